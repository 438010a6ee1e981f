// Keeping the app process of `npm start` running: a crash restarts it after a growing pause
// (1 s, 2 s, 4 s … at most 30 s), and a process that then runs well for a minute starts the count
// afresh. Plain functions with the clock passed in, so tests drive them without waiting.

/**
 * The pause before each restart.
 * @param {{ firstDelayMs?: number, maxDelayMs?: number, healthyAfterMs?: number }} [options]
 */
export function restartBackoff({ firstDelayMs = 1000, maxDelayMs = 30_000, healthyAfterMs = 60_000 } = {}) {
  let crashesInARow = 0;
  return {
    /**
     * The pause before the next start, given how long the process ran before this crash.
     * @param {number} ranForMs
     */
    delayAfterCrash(ranForMs) {
      if (ranForMs >= healthyAfterMs) crashesInARow = 0;
      const delay = Math.min(maxDelayMs, firstDelayMs * 2 ** crashesInARow);
      crashesInARow++;
      return delay;
    },
  };
}

/**
 * Starts a process and starts it again whenever it exits, until `stop()`.
 * @param {{
 *   start: () => Promise<number | null>,
 *   backoff?: ReturnType<typeof restartBackoff>,
 *   now?: () => number,
 *   wait?: (ms: number) => Promise<void>,
 *   onRestart?: (restart: { code: number | null, delayMs: number }) => void,
 * }} options  `start` resolves with the exit code once the process exits.
 */
export function keepRunning({
  start,
  backoff = restartBackoff(),
  now = Date.now,
  wait = (ms) => new Promise((resolve) => setTimeout(resolve, ms)),
  onRestart = () => {},
}) {
  let stopped = false;
  const done = (async () => {
    while (!stopped) {
      const startedAt = now();
      const code = await start();
      if (stopped) break;
      const delayMs = backoff.delayAfterCrash(now() - startedAt);
      onRestart({ code, delayMs });
      await wait(delayMs);
    }
  })();
  return {
    /** No more restarts (the caller stops the running process itself). */
    stop() {
      stopped = true;
    },
    /** Settles once the loop has ended after `stop()`. */
    done,
  };
}
