import { afterAll, afterEach, describe, expect, test, vi } from 'vitest';
import { estimate, EstimateInputError, parseRateBook, sampleProject, sampleRateBook } from '../../estimate';
import { biggestAcceptedProject } from '../../estimate/sample-big-projects';
import { createEstimatePool, EstimateTimedOut } from './estimate-pool';

const rateBook = parseRateBook(sampleRateBook());
const pool = createEstimatePool({ threads: 1, timeLimitMs: 5000 });
afterAll(() => pool.close());
afterEach(() => {
  vi.useRealTimers();
});

describe('the estimate pool', () => {
  test('gives the same estimate as the core on this thread', async () => {
    expect(await pool.compute(sampleProject(), rateBook)).toEqual(estimate(sampleProject(), rateBook, { rateBookParsed: true }));
  });

  test('brings an input error back as the core’s typed error, fields named', async () => {
    const project = { ...sampleProject(), rooms: [] };
    const error = await pool.compute(project, rateBook).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(EstimateInputError);
    expect((error as EstimateInputError).fields).toEqual({ rooms: 'Add at least one room.' });
  });

  test('stops a job at its time limit with a clean 503, and the next job is answered', async () => {
    const limited = createEstimatePool({ threads: 1, timeLimitMs: 5000 });
    try {
      await limited.compute(sampleProject(), rateBook); // the thread is up
      // A fake clock: the limit passes while the thread is still at work on a big project.
      vi.useFakeTimers({ toFake: ['setTimeout', 'clearTimeout'] });
      const job = limited.compute(biggestAcceptedProject(), rateBook).catch((e: unknown) => e);
      await new Promise((resolve) => setImmediate(resolve)); // the job has gone to the thread
      vi.advanceTimersByTime(5000);
      const error = await job;
      expect(error).toBeInstanceOf(EstimateTimedOut);
      expect(error).toMatchObject({ status: 503, headers: { 'Retry-After': '5' } });
      vi.useRealTimers();
      expect((await limited.compute(sampleProject(), rateBook)).price.totalCents).toBeGreaterThan(0);
    } finally {
      await limited.close();
    }
  });
});
