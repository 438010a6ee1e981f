/**
 * The job runner (pg-boss) in this process against a database of this file's own: it installs its
 * own schema, creates the queues and schedules of every app job, runs them, and lets go of
 * everything when stopped.
 */
import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { MikroORM } from '@mikro-orm/postgresql';
import { backgroundJobs } from '../../src/lib/server/boot/jobs';
import { currentJobRunner, JOBS_SCHEMA, startJobRunner } from '../../src/lib/server/jobs/runner';
import { kickMailDelivery, MAIL_DELIVERY_JOB } from '../../src/lib/server/mail/delivery-job';
import { enqueueMail } from '../../src/lib/server/mail/outbox';
import { OutboxMail } from '../../src/lib/server/mail/outbox-mail.entity';
import { abandonedPhotosJob } from '../../src/lib/server/photos/abandoned-photos';
import { waitForMail } from '../helpers/mailbox';
import { openMigratedDatabase } from '../helpers/migrated-database';

let orm: MikroORM;
let url: string;
let closeDatabase: () => Promise<void>;
beforeAll(async () => {
  ({ orm, url, close: closeDatabase } = await openMigratedDatabase());
});
afterAll(async () => {
  await currentJobRunner()?.stop();
  await closeDatabase?.();
});

const sql = <T>(text: string, params: unknown[] = []) => orm.em.getConnection().execute<T[]>(text, params);
const runnerConnections = async () =>
  (await sql<{ n: number }>(`select count(*)::int as n from pg_stat_activity where datname = current_database() and application_name = 'lapwing-jobs'`))[0]!.n;

describe('the job runner', () => {
  test('installs pg-boss in its own schema, runs the app’s jobs, and stops cleanly', async () => {
    const runner = await startJobRunner({ orm, connectionString: url, jobs: backgroundJobs });
    expect(currentJobRunner()).toBe(runner);

    // pg-boss made its schema itself; the app's tables stay in public.
    const schemas = await sql<{ schema_name: string }>(`select schema_name from information_schema.schemata where schema_name = ?`, [JOBS_SCHEMA]);
    expect(schemas).toHaveLength(1);
    const queues = (await runner.boss.getQueues()).map((q) => q.name);
    expect(queues).toEqual(expect.arrayContaining(backgroundJobs.map((job) => job.name)));
    const schedules = await runner.boss.getSchedules();
    expect(schedules.find((s) => s.name === MAIL_DELIVERY_JOB)?.cron).toBe('* * * * *');
    expect(schedules.find((s) => s.name === abandonedPhotosJob.name)?.cron).toBe('17 * * * *');

    // A kick after the commit has the runner deliver the mail, without any request involved.
    const to = `runner-${randomBytes(4).toString('hex')}@example.test`;
    const em = orm.em.fork();
    const queued = enqueueMail(em, { to, subject: 'Through the job runner', text: 'hello' });
    await em.flush();
    kickMailDelivery();
    await waitForMail({ to, subject: 'Through the job runner' });
    await expect.poll(async () => (await orm.em.fork().findOneOrFail(OutboxMail, queued.id)).status).toBe('sent');

    expect(await runnerConnections()).toBeGreaterThan(0);
    await runner.stop();
    expect(currentJobRunner()).toBeUndefined();
    // Every connection pg-boss opened is closed again.
    await expect.poll(runnerConnections).toBe(0);

    // Starting again (as the next process would) finds the schema in place and works.
    const again = await startJobRunner({ orm, connectionString: url, jobs: backgroundJobs });
    expect((await again.boss.getQueues()).map((q) => q.name)).toEqual(expect.arrayContaining(queues));
    await again.stop();
  });
});
