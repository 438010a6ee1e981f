import type { Adapter, DatabaseSession, DatabaseUser } from 'lucia';
import type { EntityManager } from '@mikro-orm/postgresql';
import { Company } from '../companies/company.entity';
import { User } from '../users/user.entity';
import { Session } from './session.entity';
import { sessionTokenDigest } from './tokens';

/** Lucia's view of our session row: the firm the person works in and the hard end of the session. */
export type SessionAttributes = { companyId: string | null; absoluteExpiresAt: Date };
export type UserAttributes = { email: string; name: string };

/**
 * Lucia's storage, over our MikroORM entities. Lucia calls the cookie's token the session id; we
 * store only its digest, so every method digests the id it is given.
 *
 * The absolute lifetime is enforced here: Lucia only knows one sliding expiry, so the expiry we hand
 * it is never later than the session's absolute end, and extensions are capped the same way.
 *
 * `getUserSessions` returns digests as ids (they cannot be used as cookies); nothing in the app uses it.
 */
export class MikroOrmSessionAdapter implements Adapter {
  /** `openEm` gives a fresh EntityManager per call: Lucia is shared by every request. */
  constructor(private readonly openEm: () => Promise<EntityManager>) {}

  async getSessionAndUser(sessionId: string): Promise<[DatabaseSession | null, DatabaseUser | null]> {
    const em = await this.openEm();
    const row = await em.findOne(Session, { tokenDigest: sessionTokenDigest(sessionId) }, { populate: ['user'] });
    if (!row) return [null, null];
    return [toDatabaseSession(row, sessionId), { id: row.user.id, attributes: { email: row.user.email, name: row.user.name } }];
  }

  async getUserSessions(userId: string): Promise<DatabaseSession[]> {
    const em = await this.openEm();
    const rows = await em.find(Session, { user: userId });
    return rows.map((row) => toDatabaseSession(row, row.tokenDigest));
  }

  async setSession(session: DatabaseSession): Promise<void> {
    const em = await this.openEm();
    const attributes = session.attributes as SessionAttributes;
    const expiresAt = earlier(session.expiresAt, attributes.absoluteExpiresAt);
    em.create(Session, {
      tokenDigest: sessionTokenDigest(session.id),
      user: em.getReference(User, session.userId),
      company: attributes.companyId ? em.getReference(Company, attributes.companyId) : null,
      expiresAt,
      absoluteExpiresAt: attributes.absoluteExpiresAt,
    });
    await em.flush();
  }

  async updateSessionExpiration(sessionId: string, expiresAt: Date): Promise<void> {
    const em = await this.openEm();
    await em
      .getConnection()
      .execute('update "user_session" set "expires_at" = least(?::timestamptz, "absolute_expires_at"), "updated_at" = now() where "token_digest" = ?', [
        expiresAt.toISOString(),
        sessionTokenDigest(sessionId),
      ]);
  }

  async deleteSession(sessionId: string): Promise<void> {
    const em = await this.openEm();
    await em.nativeDelete(Session, { tokenDigest: sessionTokenDigest(sessionId) });
  }

  async deleteUserSessions(userId: string): Promise<void> {
    const em = await this.openEm();
    await em.nativeDelete(Session, { user: userId });
  }

  async deleteExpiredSessions(): Promise<void> {
    const em = await this.openEm();
    await em.nativeDelete(Session, { expiresAt: { $lte: new Date() } });
  }
}

function earlier(a: Date, b: Date): Date {
  return a.getTime() <= b.getTime() ? a : b;
}

function toDatabaseSession(row: Session, id: string): DatabaseSession {
  const attributes: SessionAttributes = { companyId: row.company?.id ?? null, absoluteExpiresAt: row.absoluteExpiresAt };
  return { id, userId: row.user.id, expiresAt: earlier(row.expiresAt, row.absoluteExpiresAt), attributes };
}
