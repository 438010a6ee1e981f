import { Lucia, TimeSpan } from 'lucia';
import type { EntityManager } from '@mikro-orm/postgresql';
import { config } from '../config';
import { currentOrm } from '../db/orm-provider';
import { MikroOrmSessionAdapter, type SessionAttributes, type UserAttributes } from './mikro-orm-adapter';

/**
 * How long a session lives without use; each use in the second half of this window extends it.
 * Staff work in Inquiries most days, so a week keeps them signed in across a weekend.
 * common practice, no source.
 */
export const SESSION_IDLE_LIFETIME = new TimeSpan(7, 'd');

/**
 * However active, a person signs in again after this.
 * Source: OWASP ASVS 4.0.3 3.3.2, level 1: re-authentication at least every 30 days (from memory).
 */
export const SESSION_ABSOLUTE_LIFETIME_MS = 30 * 24 * 60 * 60 * 1000;

/**
 * Cookie name. Over HTTPS the `__Host-` prefix makes the browser insist on Secure, Path=/ and no
 * Domain, so a neighbouring subdomain cannot plant or shadow the cookie.
 * Source: OWASP ASVS 4.0.3 3.4.4 (from memory); RFC 6265bis cookie prefixes.
 */
export function sessionCookieName(): string {
  return config.secureCookies ? '__Host-lapwing_session' : 'lapwing_session';
}

export function createLucia(openEm: () => Promise<EntityManager>) {
  return new Lucia(new MikroOrmSessionAdapter(openEm), {
    sessionExpiresIn: SESSION_IDLE_LIFETIME,
    sessionCookie: {
      name: sessionCookieName(),
      // Lucia adds HttpOnly and Path=/. Lax keeps cross-site POSTs from carrying the cookie while
      // links from e-mails still arrive signed in.
      attributes: { secure: config.secureCookies, sameSite: 'lax' },
    },
    getSessionAttributes: (attributes) => ({ companyId: attributes.companyId, absoluteExpiresAt: attributes.absoluteExpiresAt }),
    getUserAttributes: (attributes) => ({ email: attributes.email, name: attributes.name }),
  });
}

export type AppLucia = ReturnType<typeof createLucia>;

let lucia: AppLucia | undefined;

/** The process-wide Lucia, over forks of the app's ORM. */
export function getLucia(): AppLucia {
  lucia ??= createLucia(async () => (await currentOrm()).em.fork());
  return lucia;
}

declare module 'lucia' {
  interface Register {
    Lucia: AppLucia;
    DatabaseSessionAttributes: SessionAttributes;
    DatabaseUserAttributes: UserAttributes;
  }
}
