import type { EntityManager } from '@mikro-orm/postgresql';
import { getLucia } from './lucia';
import { SESSION_ABSOLUTE_LIFETIME_MS } from './lucia';
import { Session } from './session.entity';
import { sessionTokenDigest } from './tokens';

/**
 * Starts a new session (a new random token every time, so a token planted before sign-in is never
 * promoted). Returns the token for the cookie.
 */
export async function startSession(userId: string, companyId: string | null): Promise<{ token: string; expiresAt: Date }> {
  const absoluteExpiresAt = new Date(Date.now() + SESSION_ABSOLUTE_LIFETIME_MS);
  const session = await getLucia().createSession(userId, { companyId, absoluteExpiresAt });
  return { token: session.id, expiresAt: session.expiresAt };
}

/** Ends one session on the server; its cookie no longer works anywhere. */
export async function endSession(token: string): Promise<void> {
  await getLucia().invalidateSession(token);
}

/** Ends every session of a person except the one making the request (after a password change). */
export async function endOtherSessions(em: EntityManager, userId: string, keepToken: string | null): Promise<number> {
  const where = keepToken ? { user: userId, tokenDigest: { $ne: sessionTokenDigest(keepToken) } } : { user: userId };
  return em.nativeDelete(Session, where);
}

/** Ends a person's sessions that are working in one firm (after a role change or removal there). */
export async function endSessionsInFirm(em: EntityManager, userId: string, companyId: string, keepToken: string | null = null): Promise<number> {
  const where = { user: userId, company: companyId, ...(keepToken ? { tokenDigest: { $ne: sessionTokenDigest(keepToken) } } : {}) };
  return em.nativeDelete(Session, where);
}

/** Moves a session to another firm of the same person (the caller checks the membership). */
export async function setSessionFirm(em: EntityManager, token: string, companyId: string): Promise<void> {
  await em.nativeUpdate(Session, { tokenDigest: sessionTokenDigest(token) }, { company: companyId });
}
