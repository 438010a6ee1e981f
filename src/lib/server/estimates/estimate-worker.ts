/**
 * The estimate as a worker-thread job: runs the estimating core off the server's event loop. Built
 * into a plain .mjs file by worker-bundle.ts (a worker thread cannot load TypeScript), and run by
 * the pool in estimate-pool.ts.
 */
import { estimateParsed, EstimateInputError, type Estimate, type Project, type RateBook } from '../../estimate/index.ts';

export interface EstimateJob {
  /** A project that passed the core's project schema (as part of the request's schema). */
  project: Project;
  /** The firm's rate book, already parsed (the main thread keeps the parse cache). */
  rateBook: RateBook;
}

/** Errors lose their class and fields crossing threads, so an input error comes back as data. */
export type EstimateAnswer = { ok: true; estimate: Estimate } | { ok: false; message: string; fields: Record<string, string> };

export default function runEstimateJob(job: EstimateJob): EstimateAnswer {
  try {
    return { ok: true, estimate: estimateParsed(job.project, job.rateBook) };
  } catch (error) {
    if (error instanceof EstimateInputError) return { ok: false, message: error.message, fields: error.fields };
    throw error;
  }
}
