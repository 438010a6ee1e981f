/**
 * Error output during a test (console.error, or a server log line at level error or above) fails
 * the test, unless the test says it expects some: a 500 it provokes on purpose, a failure path it
 * checks. The setup file tests/setup/error-output.ts records the output and checks after each test.
 *
 *   const output = expectErrorOutput();
 *   ... provoke the failure ...
 *   expect(output.join('\n')).toContain('mail delivery pass failed');
 */
import { format } from 'node:util';

type Watch = { allowed: boolean; lines: string[] };

const watch: Watch = { allowed: false, lines: [] };

/** Allows error output in the current test; returns the lines written so far and from now on. */
export function expectErrorOutput(): string[] {
  watch.allowed = true;
  return watch.lines;
}

/** For the setup file: starts a fresh watch for the next test. */
export function resetErrorOutput(): void {
  watch.allowed = false;
  watch.lines = [];
}

/** For the setup file: records one piece of error output. */
export function recordErrorOutput(source: string, args: unknown[]): void {
  watch.lines.push(`${source}: ${format(...args)}`);
}

/** For the setup file: what to complain about after a test, or null when all is well. */
export function unexpectedErrorOutput(): string | null {
  if (watch.allowed || watch.lines.length === 0) return null;
  return `Unexpected error output (call expectErrorOutput() in a test that means to cause it):\n${watch.lines.join('\n')}`;
}
