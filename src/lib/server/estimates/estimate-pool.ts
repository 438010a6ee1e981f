/**
 * Estimates are worked out on a small pool of worker threads, never on the server's event loop: a
 * costly estimate then delays only itself, while other firms, the staff area and health checks go
 * on being answered. Each job has a time limit; past it the thread is stopped and the caller gets
 * a clear 503, never a hang.
 */
import { existsSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import Piscina from 'piscina';
import { EstimateInputError, type Estimate, type Project, type RateBook } from '~/lib/estimate';
import { config } from '../config';
import { AppError } from '../errors';
import type { EstimateAnswer, EstimateJob } from './estimate-worker';

/** The job ran past the pool's time limit and was stopped. */
export class EstimateTimedOut extends AppError {
  constructor() {
    super('Working out this estimate took too long. Please try again in a moment; if it happens again, ask the firm to measure on site.', 503, undefined, {
      'Retry-After': '5',
    });
  }
}

/** Every thread is busy and the queue is full. */
export class EstimatesBusy extends AppError {
  constructor() {
    super('The estimate form is very busy right now. Please try again in a moment.', 503, undefined, { 'Retry-After': '5' });
  }
}

export interface EstimatePoolOptions {
  /** Worker threads (default: config.estimateThreads). */
  threads?: number;
  /** Longest a job may take, waiting for a thread included, in ms (default: config.estimateTimeLimitMs). */
  timeLimitMs?: number;
  /** Jobs that may wait for a thread before new ones are turned away (default: 8 per thread). */
  maxQueue?: number;
  /** The built worker file (default: next to the server bundle, or built from the sources in development). */
  workerFile?: string;
}

export interface EstimatePool {
  compute(project: Project, rateBook: RateBook): Promise<Estimate>;
  close(): Promise<void>;
}

/** Where the worker file is: beside the server bundle in a build, built on first use in development and tests. */
async function workerFile(): Promise<string> {
  if (import.meta.env.DEV) {
    const { freshEstimateWorker } = await import('./worker-bundle');
    return freshEstimateWorker();
  }
  // The bundle's chunks sit in dist/server or a folder below it; the worker sits in dist/server.
  let dir = path.dirname(fileURLToPath(import.meta.url));
  for (let up = 0; up < 4; up++, dir = path.dirname(dir)) {
    const file = path.join(dir, 'estimate-worker.mjs');
    if (existsSync(file)) return file;
  }
  throw new Error('The estimate worker (dist/server/estimate-worker.mjs) is missing: run `astro build`.');
}

export function createEstimatePool(options: EstimatePoolOptions = {}): EstimatePool {
  const threads = options.threads ?? config.estimateThreads;
  const timeLimitMs = options.timeLimitMs ?? config.estimateTimeLimitMs;
  let piscina: Promise<Piscina<EstimateJob, EstimateAnswer>> | undefined;
  const start = () =>
    (piscina ??= (options.workerFile ? Promise.resolve(options.workerFile) : workerFile()).then(
      (filename) =>
        new Piscina<EstimateJob, EstimateAnswer>({
          filename,
          minThreads: 1,
          maxThreads: threads,
          maxQueue: options.maxQueue ?? 8 * threads,
          idleTimeout: 60_000,
        }),
    ));

  return {
    async compute(project, rateBook) {
      // The clock starts now, before the worker is even found, so a fake clock in tests sees it at once.
      const deadline = new AbortController();
      const timer = setTimeout(() => deadline.abort(), timeLimitMs);
      try {
        const pool = await start();
        const answer = await pool.run({ project, rateBook }, { signal: deadline.signal });
        if (!answer.ok) throw new EstimateInputError(answer.fields, answer.message);
        return answer.estimate;
      } catch (error) {
        if (deadline.signal.aborted) throw new EstimateTimedOut();
        if (error instanceof Error && error.message === 'Task queue is at limit') throw new EstimatesBusy();
        throw error;
      } finally {
        clearTimeout(timer);
      }
    },
    async close() {
      const pool = piscina;
      piscina = undefined;
      if (pool) await (await pool).destroy();
    },
  };
}

let shared: EstimatePool | undefined;

/**
 * The estimate of a project with a firm's parsed rate book, worked out on the shared pool. Throws
 * EstimateInputError (fields named) for bad input, EstimateTimedOut or EstimatesBusy (503) otherwise.
 */
export function computeEstimate(project: Project, rateBook: RateBook): Promise<Estimate> {
  shared ??= createEstimatePool();
  return shared.compute(project, rateBook);
}

/** Stops the shared pool's threads (for tests and shutdown); the next estimate starts it again. */
export async function closeEstimatePool(): Promise<void> {
  const pool = shared;
  shared = undefined;
  await pool?.close();
}
