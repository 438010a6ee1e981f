/**
 * Mail delivery as a background job: pg-boss runs a pass every minute (so retries and anything a
 * kick missed go out), and `kickMailDelivery()` asks for one at once after a commit that queued mail.
 */
import { defineJob, sendJobIfRunning } from '../jobs/runner';
import { deliverDueMail, nextMailDueAt } from './outbox';

export const MAIL_DELIVERY_JOB = 'mail-delivery';

/** Most messages one pass takes; a full pass queues the next one straight away. */
const PASS_LIMIT = 40;

export const mailDeliveryJob = defineJob({
  name: MAIL_DELIVERY_JOB,
  schedule: '* * * * *',
  // 'stately': at most one pass queued and one running across all processes, so a burst of kicks
  // does not pile up passes (several at once would still be safe: each message is claimed).
  // No pg-boss retries: the next minute's pass is the retry.
  queue: { policy: 'stately', retryLimit: 0, expireInSeconds: 15 * 60 },
  pollingIntervalSeconds: 1,
  async run(_data, { em, send }) {
    const { claimed } = await deliverDueMail(em, { limit: PASS_LIMIT });
    if (claimed >= PASS_LIMIT) {
      await send(MAIL_DELIVERY_JOB);
      return;
    }
    // A retry due before the next minute's pass (the first ones wait 15 and 30 s) gets its own pass.
    const due = await nextMailDueAt(em.fork());
    if (due && due.getTime() < Date.now() + 60_000) {
      await send(MAIL_DELIVERY_JOB, {}, { singletonKey: 'due-soon', startAfter: due });
    }
  },
});

/**
 * Asks for a delivery pass right away. Call it after the transaction that queued the mail has
 * committed. Without a job runner in this process it does nothing; the minute's pass sends the mail.
 */
export function kickMailDelivery(): void {
  sendJobIfRunning(MAIL_DELIVERY_JOB).catch((error) => console.error('[mail] could not ask for a delivery pass:', error));
}
