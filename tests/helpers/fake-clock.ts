import { setClock, type Clock } from '../../src/lib/server/clock';

/** A clock that stands still until the test moves it. */
export class FakeClock implements Clock {
  private ms: number;

  constructor(start: Date | string) {
    this.ms = new Date(start).getTime();
    if (Number.isNaN(this.ms)) throw new RangeError(`FakeClock: not a moment: ${String(start)}`);
  }

  now(): Date {
    return new Date(this.ms);
  }

  /** Moves the clock forward (or back, with a negative number) by `ms` milliseconds. */
  advance(ms: number): void {
    this.ms += ms;
  }

  set(at: Date | string): void {
    this.ms = new Date(at).getTime();
  }
}

/**
 * Makes a fake clock the server's clock until `restore()` (call it in `afterEach`/`finally`).
 *
 *   const clock = useFakeClock('2026-03-05T15:00:00Z');
 *   clock.advance(7 * DAY_MS);
 *   clock.restore();
 */
export function useFakeClock(start: Date | string): FakeClock & { restore: () => void } {
  const clock = new FakeClock(start);
  const restore = setClock(clock);
  return Object.assign(clock, { restore });
}

export const MINUTE_MS = 60_000;
export const HOUR_MS = 60 * MINUTE_MS;
export const DAY_MS = 24 * HOUR_MS;
