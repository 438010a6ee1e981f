/**
 * The server's second entry point: the work a server process does besides answering requests.
 * It is built by Vite together with the app (so it shares the app's modules and its one ORM) and
 * started with the process, never by a request:
 *   - `node scripts/serve.mjs` imports the built `dist/server/background.mjs` and calls it;
 *   - `astro dev` loads this file through Vite once the dev server listens;
 *   - (both wired up by `boot/background-integration.mjs`) and tests call it directly.
 */
import { config } from '../config';
import { startJobRunner, type JobRunner } from '../jobs/runner';
import { backgroundJobs } from './jobs';
import { getOrm } from './orm';

export type Background = {
  /** Settles once the job runner has started (or the background was stopped first). */
  ready: Promise<void>;
  /** Stops the job runner: running jobs get a few seconds, then pg-boss lets go of them. */
  stop: () => Promise<void>;
};

/**
 * Starts the job runner with every job of the app. If the database cannot be reached yet, it
 * keeps trying every `retryMs` while the server goes on answering requests.
 */
export function startBackground({ retryMs = 5_000 }: { retryMs?: number } = {}): Background {
  let stopped = false;
  let runner: JobRunner | undefined;
  let wake: (() => void) | undefined;

  const ready = (async () => {
    while (!stopped) {
      try {
        runner = await startJobRunner({ orm: await getOrm(), connectionString: config.databaseUrl, jobs: backgroundJobs });
        console.log(`[jobs] job runner started: ${backgroundJobs.map((job) => job.name).join(', ')}`);
        return;
      } catch (error) {
        console.error(`[jobs] could not start the job runner; trying again in ${retryMs / 1000} s:`, error);
        await new Promise<void>((resolve) => {
          wake = resolve;
          setTimeout(resolve, retryMs).unref();
        });
      }
    }
  })();

  return {
    ready,
    async stop() {
      stopped = true;
      wake?.();
      await ready;
      await runner?.stop({ timeoutMs: 3_000 });
      runner = undefined;
    },
  };
}
