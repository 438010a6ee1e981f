/**
 * Runs the day-before visit reminders once as if the clock read the given moment, then delivers the
 * reminders queued for the given addresses (and nothing else). For browser tests, which cannot
 * move the app server's clock: `tsx tests/helpers/run-visit-reminders.ts ISO_TIME ADDRESS…`.
 * Prints `{"queued": n, "skipped": n}` of the whole pass.
 */
import { MikroORM } from '@mikro-orm/postgresql';
import config from '../../mikro-orm.config.ts';
import { sendDueVisitReminders } from '../../src/lib/server/visits/visit-reminders';
import { deliverDueMail } from '../../src/lib/server/mail/outbox';

const [at, ...addresses] = process.argv.slice(2);
const now = new Date(at ?? '');
if (Number.isNaN(now.getTime()) || addresses.length === 0) {
  console.error('usage: run-visit-reminders.ts ISO_TIME ADDRESS…');
  process.exit(2);
}
// The ORM from its plain config (the app's `getOrm` bundles migrations through Vite, which tsx is not).
const orm = await MikroORM.init({ ...config, clientUrl: process.env.DATABASE_URL, pool: { min: 0, max: 2 } });
try {
  const result = await sendDueVisitReminders(orm.em.fork(), { now });
  await deliverDueMail(orm.em.fork(), { only: { toAddress: { $in: addresses } } });
  console.log(JSON.stringify(result));
} finally {
  await orm.close();
}
