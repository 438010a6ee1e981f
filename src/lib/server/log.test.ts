import { describe, expect, test } from 'vitest';
import { createLogger } from './log';

function capture() {
  const lines: Record<string, unknown>[] = [];
  const logger = createLogger({ write: (line: string) => lines.push(JSON.parse(line)) }).child({}, { level: 'info' });
  return { logger, lines };
}

describe('the server log', () => {
  test('never writes session cookies, authorization headers or passwords', () => {
    const { logger, lines } = capture();
    logger.info(
      {
        headers: { cookie: 'lapwing_session=secret-token', authorization: 'Bearer secret-bearer', 'user-agent': 'Firefox' },
        form: { email: 'olive@cedar-hollow.test', password: 'lapwing-demo-2026' },
        password: 'another secret',
      },
      'sign-in refused',
    );
    const text = JSON.stringify(lines);
    for (const secret of ['secret-token', 'secret-bearer', 'lapwing-demo-2026', 'another secret']) expect(text).not.toContain(secret);
    expect(lines[0]).toMatchObject({
      headers: { cookie: '[redacted]', authorization: '[redacted]', 'user-agent': 'Firefox' },
      form: { email: 'olive@cedar-hollow.test', password: '[redacted]' },
      msg: 'sign-in refused',
    });
  });

  test("lines are JSON with pino's numeric levels", () => {
    // Source: pino documentation, "API: logger.level" (trace 10, debug 20, info 30, warn 40, error 50, fatal 60).
    const { logger, lines } = capture();
    logger.debug('not written at info');
    logger.warn('written');
    expect(lines).toEqual([expect.objectContaining({ level: 40, msg: 'written' })]);
  });
});
