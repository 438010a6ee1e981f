/**
 * Delivery passes over a test's own outbox rows only. Test files run in parallel against one
 * database; a pass over every due row would send (or, with a failing sender, delay) the mail that
 * another file is waiting for.
 */
import type { FilterQuery } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import type { OutboxMail } from '../../src/lib/server/mail/outbox-mail.entity';
import { deliverDueMail } from '../../src/lib/server/mail/outbox';
import type { SendMail } from '../../src/lib/server/mail/transport';

type Options = { send?: SendMail };

/** One delivery pass over the due rows that match `only`. */
export function deliverMatchingMail(
  em: EntityManager,
  only: FilterQuery<OutboxMail>,
  { send }: Options = {},
): Promise<{ sent: number; failed: number; claimed: number }> {
  return deliverDueMail(em, { only, send, limit: 500 });
}

/** One delivery pass over the due mail to these addresses. */
export function deliverMailTo(em: EntityManager, to: string | string[], options: Options = {}): Promise<{ sent: number; failed: number; claimed: number }> {
  return deliverMatchingMail(em, { toAddress: { $in: [to].flat() } }, options);
}
