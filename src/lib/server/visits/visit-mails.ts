/**
 * The e-mails a visit's booking, move and cancellation send to the homeowner and the salesperson,
 * each with the visit's calendar file (RFC 5545: METHOD REQUEST or CANCEL, one UID per visit,
 * SEQUENCE rising on each change), and the day-before reminders. Queued in the outbox in the
 * caller's transaction, so a change and its e-mails are stored together or not at all.
 *
 * The calendar file goes out through nodemailer's `icalEvent`, which (nodemailer 10.6.1,
 * mail-composer) writes it twice: as the `text/calendar; method=…` alternative beside the text and
 * HTML (what mail programs read as an invitation, RFC 6047 §2.4) and as an `application/ics`
 * attachment named by `filename`, here `visit.ics`, so every mail program offers an .ics file.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import type { VisitCancelledBy } from '~/lib/shared/visit-schemas';
import { visitCalendarFile, type InvitationPerson } from '~/lib/visits';
import { config } from '../config';
import { now as clockNow } from '../clock';
import { Company } from '../companies/company.entity';
import { Membership } from '../users/membership.entity';
import { Lead } from '../leads/lead.entity';
import { firmReplyTo } from '../leads/lead-mail';
import { enqueueMail } from '../mail/outbox';
import { visitLinkUrl } from './visit-link';
import { homeownerVisitMail, salespersonVisitMail, type VisitMail, type VisitMailFacts } from './visit-mail-text';
import type { Visit } from './visit.entity';

export type VisitChange = 'booked' | 'moved' | 'cancelled';

/** The file name mail programs show for the calendar attachment. */
export const CALENDAR_FILENAME = 'visit.ics';

/** One UID for every file about a visit (RFC 5545 §3.8.4.7: globally unique; the host makes it ours). */
export function visitUid(visitId: string): string {
  return `visit-${visitId}@${new URL(config.publicOrigin).hostname}`;
}

/** The address of our configured sender (`Lapwing <no-reply@…>` → `no-reply@…`). */
function senderAddress(): string {
  return /<([^<>]+)>\s*$/.exec(config.mailFrom)?.[1] ?? config.mailFrom.trim();
}

type Loaded = { company: Company; lead: Lead; salesperson: Membership | null; facts: VisitMailFacts };

async function load(em: EntityManager, visit: Visit, salespersonId: string | null | undefined): Promise<Loaded> {
  const company = await em.findOneOrFail(Company, { id: visit.company.id });
  const lead = await em.findOneOrFail(Lead, { id: visit.lead.id, company: company.id });
  const salesperson = salespersonId ? await em.findOne(Membership, { id: salespersonId, company: company.id }, { populate: ['user'] }) : null;
  return {
    company,
    lead,
    salesperson,
    facts: {
      firm: { name: company.name, phone: company.phone, timeZone: company.timeZone },
      homeowner: { name: lead.name, phone: lead.phone, email: lead.email },
      place: `${lead.address}, ${lead.postcode}`,
      salespersonName: salesperson?.user.name ?? null,
      start: visit.startsAt,
      end: visit.endsAt,
      homeownerLink: visitLinkUrl(visit.id),
      staffLink: `${config.publicOrigin}/app/leads/${lead.id}`,
    },
  };
}

function calendarFor(visit: Visit, loaded: Loaded, method: 'REQUEST' | 'CANCEL', content: VisitMail, title: string, attendees: InvitationPerson[]) {
  return {
    method,
    filename: CALENDAR_FILENAME,
    content: visitCalendarFile({
      method,
      uid: visitUid(visit.id),
      sequence: visit.sequence,
      start: visit.startsAt,
      end: visit.endsAt,
      stamp: clockNow(),
      title,
      description: content.calendarDescription,
      location: loaded.facts.place,
      // The firm organizes the visit; replies from a calendar go to its contact address.
      organizer: { name: loaded.company.name, email: firmReplyTo(loaded.company) ?? senderAddress() },
      attendees,
    }),
  };
}

function people(loaded: Loaded): InvitationPerson[] {
  const homeowner = { name: loaded.lead.name, email: loaded.lead.email };
  return loaded.salesperson ? [homeowner, { name: loaded.salesperson.user.name, email: loaded.salesperson.user.email }] : [homeowner];
}

function queueForHomeowner(em: EntityManager, loaded: Loaded, content: VisitMail, calendar?: ReturnType<typeof calendarFor>) {
  enqueueMail(em, {
    to: loaded.lead.email,
    subject: content.subject,
    text: content.text,
    html: content.html,
    // In the firm's name, from our address; a reply reaches the firm.
    fromName: loaded.company.name,
    replyTo: firmReplyTo(loaded.company),
    companyId: loaded.company.id,
    calendar,
  });
}

function queueForStaff(em: EntityManager, loaded: Loaded, to: string, content: VisitMail, calendar?: ReturnType<typeof calendarFor>) {
  enqueueMail(em, { to, subject: content.subject, text: content.text, html: content.html, companyId: loaded.company.id, calendar });
}

/**
 * Queues the invitation (booked, moved) or cancellation of a visit, as it now stands, to the
 * homeowner and the salesperson (none when the visit has nobody). When a move handed the visit to
 * someone else, the one who had it gets a cancellation of their copy.
 */
export async function queueVisitMails(
  em: EntityManager,
  visit: Visit,
  change: VisitChange,
  options: { by?: VisitCancelledBy; previousSalespersonId?: string | null } = {},
): Promise<void> {
  const loaded = await load(em, visit, visit.salesperson?.id);
  const method = change === 'cancelled' ? 'CANCEL' : 'REQUEST';
  const attendees = people(loaded);
  const byHomeowner = (change === 'cancelled' ? visit.cancelledBy : options.by) === 'homeowner';

  const forHomeowner = homeownerVisitMail(change, loaded.facts);
  queueForHomeowner(em, loaded, forHomeowner, calendarFor(visit, loaded, method, forHomeowner, `Site visit: ${loaded.company.name}`, attendees));

  if (loaded.salesperson) {
    const forSalesperson = salespersonVisitMail(change, loaded.facts, { byHomeowner });
    const title = `Site visit: ${loaded.lead.name}`;
    queueForStaff(em, loaded, loaded.salesperson.user.email, forSalesperson, calendarFor(visit, loaded, method, forSalesperson, title, attendees));
  }

  const previous = options.previousSalespersonId;
  if (change === 'moved' && previous && previous !== visit.salesperson?.id) {
    const old = await load(em, visit, previous);
    if (old.salesperson) {
      const handedOver = salespersonVisitMail('handed-over', old.facts);
      const person = { name: old.salesperson.user.name, email: old.salesperson.user.email };
      // RFC 5546 §3.2.5: a CANCEL naming only the attendee who is no longer invited.
      queueForStaff(em, old, person.email, handedOver, calendarFor(visit, old, 'CANCEL', handedOver, `Site visit: ${old.lead.name}`, [person]));
    }
  }
}

/** Queues the reminder of a booked visit to the homeowner and the salesperson (no calendar file: the invitation already has one). */
export async function queueVisitReminder(em: EntityManager, visit: Visit): Promise<void> {
  const loaded = await load(em, visit, visit.salesperson?.id);
  queueForHomeowner(em, loaded, homeownerVisitMail('reminder', loaded.facts));
  if (loaded.salesperson) queueForStaff(em, loaded, loaded.salesperson.user.email, salespersonVisitMail('reminder', loaded.facts));
}
