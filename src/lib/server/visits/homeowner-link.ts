/**
 * What the homeowner's own link shows and does: the visit on the firm's clock, the other open times
 * (the same salesperson's, or the team's when that person has none or has left), moving to one of
 * them and cancelling. The homeowner can pick only a time this offered, with the firm's minimum
 * notice; booking's own checks and the database's constraint still decide a race.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import type { HomeownerVisitView } from '~/lib/shared/homeowner-visit';
import { AppError, NotFound } from '../errors';
import { now as clockNow } from '../clock';
import { Company } from '../companies/company.entity';
import { Lead } from '../leads/lead.entity';
import { Membership } from '../users/membership.entity';
import { cancelVisit, moveVisit, SlotTaken, slotView } from './booking';
import { nextSlotsAfter, openSlotsOfFirm, type FirmSlot } from './open-slots';
import { linkState, visitOfLink, type LinkState } from './visit-link';
import type { Visit } from './visit.entity';

/** The link can no longer change the visit (cancelled, started or over): 410, with what to do instead. */
export class VisitLinkClosed extends AppError {
  constructor(state: Exclude<LinkState, 'open'>, firm: Company) {
    const call = firm.phone ? ` Call ${firm.name} on ${firm.phone}.` : ` Reply to ${firm.name}'s e-mail.`;
    const why = {
      cancelled: 'This visit was cancelled, so it can no longer be changed here. To find another time:',
      'under-way': 'This visit has started, so it can no longer be changed here. To reach the firm:',
      over: 'This visit is over, so the link no longer changes anything. To reach the firm:',
    }[state];
    super(`${why}${call}`, 410);
  }
}

/** A forged or unknown link: the same answer as any page that does not exist. */
function noSuchVisit(): NotFound {
  return new NotFound('This link does not open a visit.');
}

/** Open times the homeowner may move to: the salesperson's own, else the team's (one per time). */
export async function homeownerChoices(em: EntityManager, visit: Visit, at: Date): Promise<FirmSlot[]> {
  const companyId = visit.company.id;
  const notThisOne = (s: FirmSlot) => !(s.start.getTime() === visit.startsAt.getTime() && s.salespersonId === visit.salesperson?.id);
  if (visit.salesperson) {
    const own = (await openSlotsOfFirm(em, companyId, { salespersonId: visit.salesperson.id, now: at, ignoreVisitId: visit.id })).filter(notThisOne);
    if (own.length > 0) return own;
  }
  const seen = new Set<number>();
  return (await openSlotsOfFirm(em, companyId, { now: at, ignoreVisitId: visit.id })).filter(notThisOne).filter((s) => {
    // The team's slots list a time once per free person; the homeowner picks a time, not a person.
    if (seen.has(s.start.getTime())) return false;
    seen.add(s.start.getTime());
    return true;
  });
}

/** The page's view of a visit through its link. */
export async function homeownerVisitView(em: EntityManager, visit: Visit, at: Date = clockNow()): Promise<HomeownerVisitView> {
  const company = await em.findOneOrFail(Company, { id: visit.company.id });
  const lead = await em.findOneOrFail(Lead, { id: visit.lead.id });
  const person = visit.salesperson ? await em.findOne(Membership, { id: visit.salesperson.id }, { populate: ['user'] }) : null;
  const state = linkState(visit, at);
  return {
    state,
    firm: { name: company.name, phone: company.phone },
    timeZone: company.timeZone,
    start: visit.startsAt.toISOString(),
    end: visit.endsAt.toISOString(),
    salespersonName: person?.user.name ?? null,
    place: `${lead.address}, ${lead.postcode}`,
    slots: state === 'open' ? (await homeownerChoices(em, visit, at)).map(slotView) : [],
  };
}

/** The visit of a link that may still change it; NotFound for a bad link, VisitLinkClosed once it may not. */
async function changeableVisit(em: EntityManager, token: string | undefined, at: Date): Promise<Visit> {
  const visit = await visitOfLink(em, token);
  if (!visit) throw noSuchVisit();
  const state = linkState(visit, at);
  if (state !== 'open') throw new VisitLinkClosed(state, visit.company);
  return visit;
}

/** Moves the visit to one of the offered times; `SlotTaken` (409 with alternatives) when it is not open. */
export async function moveByHomeowner(
  em: EntityManager,
  token: string | undefined,
  input: { start: Date; salespersonId?: string },
  at: Date = clockNow(),
): Promise<HomeownerVisitView> {
  const visit = await changeableVisit(em, token, at);
  const choices = await homeownerChoices(em, visit, at);
  const chosen = choices.find((s) => s.start.getTime() === input.start.getTime() && (!input.salespersonId || s.salespersonId === input.salespersonId));
  if (!chosen) throw new SlotTaken('That time is not open any more. Choose another.', nextSlotsAfter(choices, input.start));
  const moved = await moveVisit(em, {
    companyId: visit.company.id,
    visitId: visit.id,
    start: chosen.start,
    salespersonId: chosen.salespersonId,
    by: 'homeowner',
    now: at,
  });
  return homeownerVisitView(em.fork(), moved, at);
}

/** Cancels the visit; its time is free again and everyone gets a cancellation. */
export async function cancelByHomeowner(em: EntityManager, token: string | undefined, at: Date = clockNow()): Promise<HomeownerVisitView> {
  const visit = await changeableVisit(em, token, at);
  const cancelled = await cancelVisit(em, { companyId: visit.company.id, visitId: visit.id, by: 'homeowner', now: at });
  return homeownerVisitView(em.fork(), cancelled, at);
}
