/**
 * The homeowner's own link to a visit, from its e-mails: `/visit/<visitId>.<signature>`, where the
 * signature is HMAC-SHA256 under APP_SECRET of `visit-manage:<visitId>` (base64url). Nothing is
 * stored: the link names one visit and proves it was signed here. The purpose prefix keeps it from
 * working as any other token the app signs (form tokens, invite and reset digests use their own).
 *
 * The link is good until the visit is over: once `endsAt` has passed, or the visit is cancelled,
 * done or no one was home, the page says so and gives the firm's phone. Changes (move, cancel)
 * stop at the visit's start.
 */
import { createHmac, timingSafeEqual } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import { isId } from '~/lib/shared/ids';
import { config } from '../config';
import { Visit } from './visit.entity';

const PURPOSE = 'visit-manage';
/** SHA-256 is 32 bytes: 43 characters of unpadded base64url. */
const SIGNATURE_SHAPE = /^[A-Za-z0-9_-]{43}$/;

function signature(visitId: string): string {
  return createHmac('sha256', config.appSecret).update(`${PURPOSE}:${visitId.toLowerCase()}`).digest('base64url');
}

/** The token of a visit's link (its id, a dot, the signature). */
export function visitLinkToken(visitId: string): string {
  return `${visitId}.${signature(visitId)}`;
}

/** The full link, as e-mails carry it. */
export function visitLinkUrl(visitId: string): string {
  return `${config.publicOrigin}/visit/${visitLinkToken(visitId)}`;
}

/** The visit id a token names when its signature is right; null for anything else (compared in constant time). */
export function visitIdOfToken(token: string | undefined): string | null {
  if (typeof token !== 'string' || token.length > 100) return null;
  const dot = token.indexOf('.');
  const id = token.slice(0, dot);
  const given = token.slice(dot + 1);
  if (dot < 0 || !isId(id) || !SIGNATURE_SHAPE.test(given)) return null;
  const expected = Buffer.from(signature(id));
  const actual = Buffer.from(given);
  return expected.length === actual.length && timingSafeEqual(expected, actual) ? id : null;
}

/** The visit a link opens, with its inquiry, firm and salesperson, or null (a forged or unknown link). */
export async function visitOfLink(em: EntityManager, token: string | undefined): Promise<Visit | null> {
  const id = visitIdOfToken(token);
  if (!id) return null;
  // The signature names the visit; its own row names the firm, so no firm comes from the request.
  const visit = await em.findOne(Visit, { id }, { populate: ['lead', 'company', 'salesperson.user'] });
  // An inquiry the firm deleted takes its visits' links with it.
  return visit && !visit.lead.deletedAt ? visit : null;
}

/**
 * What the link may still do:
 * - `open`: the visit is booked and has not started; it can be moved or cancelled.
 * - `under-way`: booked, started, not yet ended; shown, but changes go through the firm's phone.
 * - `cancelled`, `over` (ended, done or no one home): the link only says so.
 */
export type LinkState = 'open' | 'under-way' | 'cancelled' | 'over';

export function linkState(visit: Pick<Visit, 'status' | 'startsAt' | 'endsAt'>, at: Date): LinkState {
  if (visit.status === 'cancelled') return 'cancelled';
  if (visit.status !== 'booked' || visit.endsAt.getTime() <= at.getTime()) return 'over';
  return visit.startsAt.getTime() <= at.getTime() ? 'under-way' : 'open';
}
