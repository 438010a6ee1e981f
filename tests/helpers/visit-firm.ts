/**
 * A firm that takes site visits, for the visit tests: New York time, a phone and a contact address,
 * an owner and two salespeople with weekday hours, and inquiries with their own homeowner addresses.
 * Demo data: invented names, `.test` domains.
 */
import { randomBytes } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import { Availability } from '../../src/lib/server/visits/availability.entity';
import { bookVisit } from '../../src/lib/server/visits/booking';
import type { Visit } from '../../src/lib/server/visits/visit.entity';
import { buildFirm } from './accounts';
import { buildLead } from './factories';

export type VisitFirm = Awaited<ReturnType<typeof visitFirm>>;

export async function visitFirm(em: EntityManager, settings: { minNoticeMinutes?: number; weekly?: Record<string, { from: string; to: string }[]> } = {}) {
  const firm = await buildFirm(
    em,
    [
      { name: 'Opal', role: 'owner' },
      { name: 'Sid', role: 'sales' },
      { name: 'Ruth', role: 'sales' },
    ],
    { timeZone: 'America/New_York' },
  );
  Object.assign(firm.company, {
    phone: '(555) 010-2233',
    contactEmail: `desk-${firm.tag}@firm.test`,
    visitMinutes: 60,
    visitBufferMinutes: 30,
    visitStepMinutes: 60,
    visitMinNoticeMinutes: settings.minNoticeMinutes ?? 0,
    visitHorizonDays: 28,
  });
  const weekday = [{ from: '09:00', to: '17:00' }];
  const weekly = settings.weekly ?? { mon: weekday, tue: weekday, wed: weekday, thu: weekday, fri: weekday };
  for (const person of firm.members.slice(1)) em.create(Availability, { company: firm.company, membership: person.membership, weekly });
  await em.flush();
  const [owner, sid, ruth] = firm.members as [(typeof firm.members)[0], (typeof firm.members)[0], (typeof firm.members)[0]];
  return { ...firm, owner, sid, ruth };
}

/** An inquiry of the firm with a homeowner address of its own (so mail to it is this test's alone). */
export async function visitLead(em: EntityManager, firm: VisitFirm, name = 'Robin Hale') {
  const email = `home-${randomBytes(4).toString('hex')}@example.test`;
  const lead = buildLead(em, firm.company.id, { name, email });
  lead.address = '12 Alder Row';
  lead.postcode = '10027';
  await em.flush();
  return lead;
}

/** Books a visit as the owner would by phone. */
export function bookAsStaff(em: EntityManager, firm: VisitFirm, leadId: string, start: string, salesperson = firm.sid): Promise<Visit> {
  return bookVisit(em, {
    companyId: firm.company.id,
    leadId,
    start: new Date(start),
    salespersonId: salesperson.membership.id,
    via: 'staff',
    bookedByUserId: firm.owner.user.id,
  });
}
