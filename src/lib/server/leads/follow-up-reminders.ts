/**
 * Reminder e-mails for follow-ups that have come due: to the inquiry's assignee, or, when it has
 * none, to whoever set the follow-up. Each reminder is claimed (its `sentAt` set) in the same
 * transaction that queues its e-mail in the outbox, so it goes out once however many processes
 * run the job, and a run cut short is finished by the next one.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import { config } from '../config';
import { now as clockNow } from '../clock';
import { defineJob } from '../jobs/runner';
import { enqueueMail } from '../mail/outbox';
import { kickMailDelivery } from '../mail/delivery-job';
import { formatInZone } from '~/lib/shared/time';
import { stageLabel } from '~/lib/shared/labels';
import { FollowUpReminder } from './follow-up-reminder.entity';

/** Reminders looked at per round; the job goes on until none is due. */
const BATCH = 100;

export function followUpReminderMail(input: {
  leadName: string;
  reference: string;
  leadId: string;
  stage: Parameters<typeof stageLabel>[0];
  dueAt: Date;
  timeZone: string;
}) {
  return {
    subject: `Follow up today: ${input.leadName} (${input.reference})`,
    text: [
      `The follow-up you planned for ${input.leadName}'s inquiry ${input.reference} is due now`,
      `(${formatInZone(input.dueAt, input.timeZone, 'dateTimeZone')}). It is at ${stageLabel(input.stage)}.`,
      '',
      'Open the inquiry:',
      `${config.publicOrigin}/app/leads/${input.leadId}`,
    ].join('\n'),
  };
}

/**
 * Queues the reminder of every follow-up due by `now` that has not had one. A reminder whose
 * inquiry was deleted, or whose follow-up was moved since, is marked done without an e-mail.
 * This sweeps all firms at once (a maintenance task, not a request); each reminder is read with
 * its own firm's id, and its e-mail carries that firm.
 */
export async function sendDueFollowUpReminders(em: EntityManager, { now = clockNow() }: { now?: Date } = {}): Promise<{ queued: number; skipped: number }> {
  let queued = 0;
  let skipped = 0;
  for (;;) {
    const due = await em.fork().find(FollowUpReminder, { sentAt: null, dueAt: { $lte: now } }, { orderBy: { dueAt: 'asc' }, limit: BATCH });
    for (const { id } of due) {
      const outcome = await em.fork().transactional(async (tx) => {
        const claimed = await tx.nativeUpdate(FollowUpReminder, { id, sentAt: null }, { sentAt: now });
        if (claimed === 0) return 'taken';
        const reminder = await tx.findOneOrFail(FollowUpReminder, { id }, { populate: ['lead', 'lead.assignee.user', 'setBy', 'company'] });
        const { lead, company } = reminder;
        if (lead.company.id !== company.id) return 'skipped';
        const current = lead.nextFollowUpAt?.getTime() === reminder.dueAt.getTime() && !lead.deletedAt;
        const to = lead.assignee?.user.email ?? reminder.setBy?.email;
        if (!current || !to) return 'skipped';
        const mail = followUpReminderMail({
          leadName: lead.name,
          reference: lead.reference,
          leadId: lead.id,
          stage: lead.stage,
          dueAt: reminder.dueAt,
          timeZone: company.timeZone,
        });
        enqueueMail(tx, { to, ...mail, companyId: company.id });
        return 'queued';
      });
      if (outcome === 'queued') queued++;
      if (outcome === 'skipped') skipped++;
    }
    if (due.length < BATCH) break;
  }
  if (queued > 0) kickMailDelivery();
  return { queued, skipped };
}

export const followUpRemindersJob = defineJob({
  name: 'follow-up-reminders',
  // Every minute: a reminder arrives within about a minute of the time the person chose.
  schedule: '* * * * *',
  queue: { policy: 'stately', retryLimit: 0, expireInSeconds: 10 * 60 },
  pollingIntervalSeconds: 15,
  async run(_data, { em }) {
    await sendDueFollowUpReminders(em);
  },
});
