import { defineMiddleware } from 'astro:middleware';
import { listFirmsOfUser } from '../users/memberships';
import { clearSessionCookie, readSessionToken, setSessionCookie } from './cookies';
import { getLucia } from './lucia';
import { isHomeownerVisitPath, isPublicWidgetPath } from './paths';
import { setSessionFirm } from './sessions';

/** Lucia's tokens: 25 random bytes in lower-case base32. Anything else is not looked up. */
const TOKEN_SHAPE = /^[a-z2-7]{40}$/;

/**
 * Puts the signed-in person, their session and the firm they are working in on `locals`
 * (all null when signed out). Sessions slide forward on use; a dead cookie is cleared.
 */
export const session = defineMiddleware(async (context, next) => {
  const { locals, cookies } = context;
  locals.user = null;
  locals.session = null;
  locals.membership = null;
  locals.memberships = [];
  // The widget and the homeowner's visit link are for people outside the firm: no staff session there.
  if (isPublicWidgetPath(context.url.pathname) || isHomeownerVisitPath(context.url.pathname)) return next();

  const token = readSessionToken(cookies);
  if (!token) return next();
  const found = TOKEN_SHAPE.test(token) ? await getLucia().validateSession(token) : { session: null, user: null };
  if (!found.session) {
    clearSessionCookie(cookies);
    return next();
  }
  if (found.session.fresh) setSessionCookie(cookies, token);

  const memberships = await listFirmsOfUser(locals.em, found.user.id);
  const active = memberships.find((m) => m.companyId === found.session.companyId) ?? memberships[0] ?? null;
  // The firm the session pointed at is gone (removed from that team): continue in another one.
  if (active && active.companyId !== found.session.companyId) await setSessionFirm(locals.em, token, active.companyId);

  locals.user = { id: found.user.id, email: found.user.email, name: found.user.name };
  locals.session = { token, expiresAt: found.session.expiresAt, absoluteExpiresAt: found.session.absoluteExpiresAt };
  locals.membership = active;
  locals.memberships = memberships;
  return next();
});
