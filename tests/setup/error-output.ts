// Fails any test that writes error output it did not declare (see tests/helpers/error-output.ts).
import { afterEach, beforeEach } from 'vitest';
import { onErrorLine } from '../../src/lib/server/log';
import { recordErrorOutput, resetErrorOutput, unexpectedErrorOutput } from '../helpers/error-output';

// Recorded, not printed: an unexpected line appears in the failure, an expected one stays quiet.
console.error = (...args: unknown[]) => recordErrorOutput('console.error', args);
onErrorLine((args) => recordErrorOutput('log', args));

beforeEach(() => {
  resetErrorOutput();
});

afterEach(() => {
  const complaint = unexpectedErrorOutput();
  if (complaint) throw new Error(complaint);
});
