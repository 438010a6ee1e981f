import { expect, test } from 'vitest';
import { logger as processLog } from '../../src/lib/server/log';
import { expectErrorOutput, resetErrorOutput, unexpectedErrorOutput } from '../helpers/error-output';

// Error lines written whatever LOG_LEVEL the run has (a child logger keeps the hooks of its parent).
const logger = processLog.child({}, { level: 'warn' });

test('an undeclared console.error or error log line is held against the test', () => {
  console.error('a console error nobody expected');
  logger.error({ part: 'mail' }, 'an error line nobody expected');
  const complaint = unexpectedErrorOutput();
  expect(complaint).toContain('console.error: a console error nobody expected');
  expect(complaint).toContain('an error line nobody expected');
  // This test wrote them on purpose; clear them so the check after it passes.
  resetErrorOutput();
});

test('a test that declares it expects error output may write it, and sees what was written', () => {
  const output = expectErrorOutput();
  console.error('expected: the stand-in is down');
  logger.fatal('expected: a fatal line');
  expect(unexpectedErrorOutput()).toBeNull();
  expect(output).toEqual([expect.stringContaining('expected: the stand-in is down'), expect.stringContaining('expected: a fatal line')]);
});

test('warnings are not error output', () => {
  logger.warn('the database is away; answered 503');
  expect(unexpectedErrorOutput()).toBeNull();
});
