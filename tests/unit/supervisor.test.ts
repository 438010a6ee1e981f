import { describe, expect, test } from 'vitest';
import { keepRunning, restartBackoff } from '../../scripts/lib/supervisor.mjs';

// The schedule is our own choice (the brief for `npm start`): double from 1 s, cap at 30 s, start
// afresh after a minute of good running. common practice, no source.
describe('restartBackoff', () => {
  test('doubles the pause from 1 s after each crash in a row, up to 30 s', () => {
    const backoff = restartBackoff();
    const delays = Array.from({ length: 8 }, () => backoff.delayAfterCrash(500));
    expect(delays).toEqual([1000, 2000, 4000, 8000, 16000, 30000, 30000, 30000]);
  });

  test('a process that ran for a minute before crashing is restarted after 1 s again', () => {
    const backoff = restartBackoff();
    for (let i = 0; i < 4; i++) backoff.delayAfterCrash(2000);
    expect(backoff.delayAfterCrash(59_999)).toBe(16000);
    expect(backoff.delayAfterCrash(60_000)).toBe(1000);
    expect(backoff.delayAfterCrash(100)).toBe(2000);
  });
});

describe('keepRunning', () => {
  test('starts the process again after each crash, with the back-off, until stopped', async () => {
    let clock = 0;
    const waits: number[] = [];
    const restarts: { code: number | null; delayMs: number }[] = [];
    // Each run lasts as long as the list says, then exits with code 1; the fourth run is stopped by the owner.
    const runFor = [1000, 1000, 90_000];
    let starts = 0;
    let release: () => void = () => {};
    let fourthStarted: () => void = () => {};
    const fourthStart = new Promise<void>((resolve) => (fourthStarted = resolve));
    const supervisor = keepRunning({
      now: () => clock,
      wait: async (ms) => {
        waits.push(ms);
        clock += ms;
      },
      onRestart: (restart) => restarts.push(restart),
      start: () => {
        starts++;
        const ran = runFor.shift();
        if (ran === undefined) {
          fourthStarted();
          return new Promise<number | null>((resolve) => (release = () => resolve(null)));
        }
        clock += ran;
        return Promise.resolve(1);
      },
    });
    await fourthStart;
    supervisor.stop();
    release();
    await supervisor.done;
    expect(waits).toEqual([1000, 2000, 1000]);
    expect(restarts).toEqual([
      { code: 1, delayMs: 1000 },
      { code: 1, delayMs: 2000 },
      { code: 1, delayMs: 1000 },
    ]);
    expect(starts).toBe(4);
  });
});
