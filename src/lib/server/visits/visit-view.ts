import type { EntityManager } from '@mikro-orm/postgresql';
import type { VisitStatus } from '~/lib/shared/visit-schemas';
import { Membership } from '../users/membership.entity';
import type { Visit } from './visit.entity';

/** A visit as the staff API answers it. */
export type VisitView = {
  id: string;
  leadId: string;
  salespersonId: string | null;
  salespersonName: string | null;
  start: string;
  end: string;
  status: VisitStatus;
  sequence: number;
  note: string | null;
};

export async function visitView(em: EntityManager, visit: Visit): Promise<VisitView> {
  const person = visit.salesperson ? await em.findOne(Membership, { id: visit.salesperson.id }, { populate: ['user'] }) : null;
  return {
    id: visit.id,
    leadId: visit.lead.id,
    salespersonId: visit.salesperson?.id ?? null,
    salespersonName: person?.user.name ?? null,
    start: visit.startsAt.toISOString(),
    end: visit.endsAt.toISOString(),
    status: visit.status,
    sequence: visit.sequence,
    note: visit.note,
  };
}
