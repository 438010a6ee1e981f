import { afterAll, afterEach, describe, expect, test, vi } from 'vitest';
import { estimate, EstimateInputError, parseRateBook, projectSchema, sampleProject, sampleRateBook, type ProjectInput } from '~/lib/estimate';
import { biggestAcceptedProject } from '~/lib/estimate/sample-big-projects';
import { createEstimatePool, EstimateTimedOut } from './estimate-pool';

const rateBook = parseRateBook(sampleRateBook());
/** The pool takes projects already parsed by the request's schema. */
const parsed = (project: ProjectInput) => projectSchema.parse(project);
const pool = createEstimatePool({ threads: 1, timeLimitMs: 5000 });
afterAll(() => pool.close());
afterEach(() => {
  vi.useRealTimers();
});

describe('the estimate pool', () => {
  test('gives the same estimate as the core on this thread', async () => {
    expect(await pool.compute(parsed(sampleProject()), rateBook)).toEqual(estimate(sampleProject(), rateBook));
  });

  test('brings an input error back as the core’s typed error, fields named', async () => {
    const project = parsed(sampleProject());
    project.rooms[0]!.treatment.id = 'marble-slab';
    const error = await pool.compute(project, rateBook).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(EstimateInputError);
    expect(Object.keys((error as EstimateInputError).fields)).toEqual(['rooms.0.treatment.id']);
  });

  test('stops a job at its time limit with a clean 503, and the next job is answered', async () => {
    const limited = createEstimatePool({ threads: 1, timeLimitMs: 5000 });
    try {
      await limited.compute(parsed(sampleProject()), rateBook); // the thread is up
      // A fake clock: the limit passes while the thread is still at work on a big project.
      vi.useFakeTimers({ toFake: ['setTimeout', 'clearTimeout'] });
      const job = limited.compute(parsed(biggestAcceptedProject()), rateBook).catch((e: unknown) => e);
      await new Promise((resolve) => setImmediate(resolve)); // the job has gone to the thread
      vi.advanceTimersByTime(5000);
      const error = await job;
      expect(error).toBeInstanceOf(EstimateTimedOut);
      expect(error).toMatchObject({ status: 503, headers: { 'Retry-After': '5' } });
      vi.useRealTimers();
      expect((await limited.compute(parsed(sampleProject()), rateBook)).price.totalCents).toBeGreaterThan(0);
    } finally {
      await limited.close();
    }
  });
});
