/**
 * The e-mails a visit's booking, move and cancellation send to the homeowner and the salesperson,
 * each with the visit's calendar file (RFC 5545: METHOD REQUEST or CANCEL, one UID per visit,
 * SEQUENCE rising on each change). Queued in the outbox in the caller's transaction.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import type { Visit } from './visit.entity';

export type VisitChange = 'booked' | 'moved' | 'cancelled';

// Filled in with the invitations (issue 12, invitations part); booking calls it already.
export async function queueVisitMails(_em: EntityManager, _visit: Visit, _change: VisitChange): Promise<void> {}
