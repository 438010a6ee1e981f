/**
 * Where server code gets the current time when the answer decides something: whether a link has
 * expired, when a new one will. Tests swap in a clock they move by hand (tests/helpers/fake-clock.ts),
 * so "a week later" needs no waiting and no rows edited behind the code's back.
 */
export type Clock = { now(): Date };

export const systemClock: Clock = { now: () => new Date() };

let current: Clock = systemClock;

/** The current time by the active clock (the system's, unless a test set another). */
export function now(): Date {
  return current.now();
}

/** Milliseconds since the epoch by the active clock. */
export function nowMs(): number {
  return current.now().getTime();
}

/** Makes `clock` the active clock; returns a function that restores the one before. */
export function setClock(clock: Clock): () => void {
  const previous = current;
  current = clock;
  return () => {
    current = previous;
  };
}
