/**
 * After a site visit: the salesperson marks it done or "no one home". Only a booked visit whose
 * start has passed by the server's clock can have an outcome; the visit, its timeline entry and
 * nothing else change together. No one home leaves the inquiry's stage where it is (the
 * salesperson books again); done opens the measured rooms on the inquiry page, and the stage moves
 * to Measured once they are saved (measured-rooms.ts).
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import { formatInZone } from '~/lib/shared/time';
import type { z } from 'zod';
import type { visitOutcomeSchema } from '~/lib/shared/visit-schemas';
import { Conflict, NotFound } from '../errors';
import { now as clockNow } from '../clock';
import { Company } from '../companies/company.entity';
import { Membership } from '../users/membership.entity';
import { Lead } from '../leads/lead.entity';
import { recordLeadEvent } from '../leads/lead-events';
import { visitOfCompany } from './booking';
import type { Visit } from './visit.entity';

export type VisitOutcome = z.output<typeof visitOutcomeSchema>['outcome'];

export type OutcomeRequest = { companyId: string; visitId: string; outcome: VisitOutcome; actorUserId: string | null; now?: Date };

async function outcomeText(em: EntityManager, company: Company, visit: Visit, outcome: VisitOutcome): Promise<string> {
  const person = visit.salesperson ? await em.findOne(Membership, { id: visit.salesperson.id }, { populate: ['user'] }) : null;
  const when = `${formatInZone(visit.startsAt, company.timeZone, 'dateTimeZone')}${person ? ` with ${person.user.name}` : ''}`;
  return outcome === 'done' ? `Visit done: ${when}` : `No one home for the visit of ${when}`;
}

/** Records the visit's outcome; 409 when it is not booked or has not started yet. */
export async function recordVisitOutcome(em: EntityManager, request: OutcomeRequest): Promise<Visit> {
  const at = request.now ?? clockNow();
  return em.transactional(async (tx) => {
    const company = await tx.findOneOrFail(Company, { id: request.companyId });
    const visit = await visitOfCompany(tx, request.companyId, request.visitId, true);
    const lead = await tx.findOne(Lead, { id: visit.lead.id, company: request.companyId, deletedAt: null });
    if (!lead) throw new NotFound('No such visit.');
    if (visit.status !== 'booked')
      throw new Conflict('This visit is no longer booked, so it cannot be marked.', { outcome: 'This visit is no longer booked.' });
    if (visit.startsAt.getTime() > at.getTime()) {
      throw new Conflict('This visit has not started yet. Mark it once it has begun.', {
        outcome: `The visit starts ${formatInZone(visit.startsAt, company.timeZone, 'dateTimeZone')}.`,
      });
    }
    visit.status = request.outcome;
    visit.outcomeAt = at;
    recordLeadEvent(tx, lead, 'visit', {
      actorUserId: request.actorUserId,
      at,
      data: { action: request.outcome, visitId: visit.id, at: visit.startsAt.toISOString(), text: await outcomeText(tx, company, visit, request.outcome) },
    });
    return visit;
  });
}
