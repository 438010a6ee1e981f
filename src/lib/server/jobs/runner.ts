/**
 * Background jobs on PostgreSQL with pg-boss: queued work, retries and cron schedules that hold
 * across every app process (pg-boss claims jobs with SKIP LOCKED and runs each cron tick once).
 *
 * This module is generic: it knows pg-boss and the ORM, not which jobs exist. The list of jobs is
 * composed in `boot/background.ts`; a domain describes its own job with `defineJob`.
 *
 * pg-boss keeps its tables in its own schema (`pgboss`), which it creates and migrates itself on
 * start. The ORM's migrations and its schema diff only look at `public`, so the two never meet.
 */
import PgBoss from 'pg-boss';
import type { EntityManager, MikroORM } from '@mikro-orm/postgresql';

export const JOBS_SCHEMA = 'pgboss';

export type JobContext = {
  /** A fresh EntityManager for this run; jobs never share one. */
  em: EntityManager;
  /** Queues another job (or the same one again) from inside a job. */
  send: (name: string, data?: object, options?: PgBoss.SendOptions) => Promise<string | null>;
};

export type JobDefinition<Data extends object = object> = {
  /** The queue's name: letters, digits and hyphens. Changing a queue's policy needs a new name. */
  name: string;
  run: (data: Data, context: JobContext) => Promise<void>;
  /** A cron line (UTC, five fields) on which pg-boss queues this job, once across all processes. */
  schedule?: string;
  /** pg-boss queue settings: `policy` ('stately': at most one queued and one running), retries, expiry. */
  queue?: Omit<PgBoss.Queue, 'name'>;
  /** How often an idle worker asks for this job (pg-boss's default is 2 s). */
  pollingIntervalSeconds?: number;
};

/** Declares a job; the identity function exists for the types. */
export function defineJob<Data extends object = object>(definition: JobDefinition<Data>): JobDefinition<Data> {
  return definition;
}

export type JobRunner = {
  send: JobContext['send'];
  /** Stops taking jobs, waits up to `timeoutMs` for running ones, then closes the connections. */
  stop: (options?: { timeoutMs?: number }) => Promise<void>;
  /** The pg-boss instance, for tests and maintenance scripts. */
  boss: PgBoss;
};

let current: JobRunner | undefined;

/** The runner started in this process, if any. */
export function currentJobRunner(): JobRunner | undefined {
  return current;
}

/**
 * Queues a job if this process runs the job runner, and otherwise does nothing: every job that
 * can be sent this way also runs on a schedule, so a missed send only delays the work.
 */
export async function sendJobIfRunning(name: string, data: object = {}, options: PgBoss.SendOptions = {}): Promise<string | null> {
  return current ? current.send(name, data, options) : null;
}

export type StartOptions = {
  orm: MikroORM;
  connectionString: string;
  // Each job has its own data type; the runner hands every job the data it was sent with.
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  jobs: readonly JobDefinition<any>[];
  /** Connections pg-boss may open besides the ORM's pool (its polling, cron and maintenance). */
  maxConnections?: number;
  onError?: (error: unknown) => void;
};

/**
 * Starts pg-boss (creating or migrating its schema), creates each job's queue, registers the
 * cron schedules and starts one worker per job. One runner per process.
 */
export async function startJobRunner({ orm, connectionString, jobs, maxConnections = 4, onError = defaultOnError }: StartOptions): Promise<JobRunner> {
  if (current) throw new Error('The job runner is already running in this process.');
  const boss = new PgBoss({ connectionString, schema: JOBS_SCHEMA, max: maxConnections, application_name: 'lapwing-jobs' });
  boss.on('error', onError);
  await boss.start();

  const send: JobContext['send'] = (name, data = {}, options = {}) => boss.send(name, data, options);
  try {
    for (const job of jobs) {
      await boss.createQueue(job.name, { name: job.name, ...job.queue });
      if (job.schedule) await boss.schedule(job.name, job.schedule);
      else await boss.unschedule(job.name);
      // pg-boss checks option keys with `in`, so an absent interval must not be passed as undefined.
      const polling = job.pollingIntervalSeconds ? { pollingIntervalSeconds: job.pollingIntervalSeconds } : {};
      await boss.work<object>(job.name, { batchSize: 1, ...polling }, async (batch) => {
        for (const item of batch) await job.run(item.data ?? {}, { em: orm.em.fork(), send });
      });
    }
  } catch (error) {
    await boss.stop({ graceful: false });
    throw error;
  }

  const runner: JobRunner = {
    boss,
    send,
    async stop({ timeoutMs = 4_000 } = {}) {
      if (current === runner) current = undefined;
      // Jobs still running after the timeout are marked failed; pg-boss retries them, and the
      // jobs themselves are written so that an interrupted run is picked up again.
      await boss.stop({ graceful: true, wait: true, timeout: timeoutMs }).catch(onError);
    },
  };
  current = runner;
  return runner;
}

function defaultOnError(error: unknown): void {
  console.error('[jobs]', error);
}
