/**
 * The day-before reminders of booked visits, to the homeowner and the salesperson. Booking sets
 * `reminderDueAt` (09:00 on the firm's clock the day before, or at once when booked less than a day
 * ahead: `reminderDueAt` in src/lib/visits); moving sets it for the new time and clears
 * `reminderSentAt`; a cancelled visit is never reminded (only booked visits are looked at).
 *
 * Each reminder is claimed (its `reminderSentAt` set, only while still null) in the same
 * transaction that queues its e-mails, so it goes out once however many processes run the job at
 * the same moment, and a run cut short is finished by the next one.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import { now as clockNow } from '../clock';
import { defineJob } from '../jobs/runner';
import { kickMailDelivery } from '../mail/delivery-job';
import { Lead } from '../leads/lead.entity';
import { Visit } from './visit.entity';
import { queueVisitReminder } from './visit-mails';

/** Visits looked at per round; the job goes on until none is due. */
const BATCH = 100;

export async function sendDueVisitReminders(em: EntityManager, { now = clockNow() }: { now?: Date } = {}): Promise<{ queued: number; skipped: number }> {
  let queued = 0;
  let skipped = 0;
  const due = { status: 'booked' as const, reminderSentAt: null, reminderDueAt: { $lte: now } };
  for (;;) {
    const batch = await em.fork().find(Visit, due, { fields: ['id'], orderBy: { reminderDueAt: 'asc', id: 'asc' }, limit: BATCH });
    for (const { id } of batch) {
      const outcome = await em.fork().transactional(async (tx) => {
        // The claim: a second run (or process) waits on this row and then finds it taken.
        const claimed = await tx.nativeUpdate(Visit, { id, ...due }, { reminderSentAt: now });
        if (claimed === 0) return 'taken';
        const visit = await tx.findOneOrFail(Visit, { id });
        // The job was down past the visit's start, or the inquiry is gone: too late to remind.
        const lead = await tx.findOne(Lead, { id: visit.lead.id, company: visit.company.id, deletedAt: null });
        if (visit.startsAt.getTime() <= now.getTime() || !lead) return 'skipped';
        await queueVisitReminder(tx, visit);
        return 'queued';
      });
      if (outcome === 'queued') queued++;
      if (outcome === 'skipped') skipped++;
    }
    if (batch.length < BATCH) break;
  }
  if (queued > 0) kickMailDelivery();
  return { queued, skipped };
}

export const visitRemindersJob = defineJob({
  name: 'visit-reminders',
  // Every minute: a reminder goes out within about a minute of 09:00 on the firm's clock.
  schedule: '* * * * *',
  queue: { policy: 'stately', retryLimit: 0, expireInSeconds: 10 * 60 },
  pollingIntervalSeconds: 15,
  async run(_data, { em }) {
    await sendDueVisitReminders(em);
  },
});
