import { createHmac, randomUUID, timingSafeEqual } from 'node:crypto';
import { config } from '../config';
import { InvalidInput } from '../errors';

/**
 * The widget keeps no cookies (it lives in a third-party iframe). Instead the embed page carries a
 * signed form token: which firm, which draft (photos are uploaded under it) and when the form was
 * opened (for the minimum time to submit). Signed with HMAC-SHA-256 under APP_SECRET.
 */
export type FormToken = { companyId: string; draftId: string; issuedAt: number };

/** A form token is good for a day; after that the homeowner reloads the page. */
export const FORM_TOKEN_TTL_MS = 24 * 60 * 60 * 1000;

function sign(payload: string): string {
  return createHmac('sha256', config.appSecret).update(`form-token:${payload}`).digest('base64url');
}

export function issueFormToken(companyId: string, now = Date.now()): { token: string; draftId: string } {
  const draftId = randomUUID();
  const payload = Buffer.from(JSON.stringify({ c: companyId, d: draftId, t: now })).toString('base64url');
  return { token: `${payload}.${sign(payload)}`, draftId };
}

/** Checks the signature, the firm and the age; throws InvalidInput naming `formToken` otherwise. */
export function verifyFormToken(token: string, companyId: string, now = Date.now()): FormToken {
  const refuse = (why: string) => new InvalidInput(why, { formToken: why });
  const [payload, signature] = token.split('.');
  if (!payload || !signature) throw refuse('This form is not valid any more. Please reload the page.');
  const expected = Buffer.from(sign(payload));
  const given = Buffer.from(signature);
  if (expected.length !== given.length || !timingSafeEqual(expected, given)) throw refuse('This form is not valid any more. Please reload the page.');
  let data: { c?: unknown; d?: unknown; t?: unknown };
  try {
    data = JSON.parse(Buffer.from(payload, 'base64url').toString('utf8'));
  } catch {
    throw refuse('This form is not valid any more. Please reload the page.');
  }
  if (data.c !== companyId || typeof data.d !== 'string' || typeof data.t !== 'number') throw refuse('This form belongs to another page. Please reload.');
  if (now - data.t > FORM_TOKEN_TTL_MS) throw refuse('This form has been open for over a day. Please reload the page to start fresh.');
  return { companyId: data.c, draftId: data.d, issuedAt: data.t };
}
