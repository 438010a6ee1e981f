import type { APIRoute } from 'astro';
import { clearSessionCookie } from '~/lib/server/auth/cookies';
import { endSession } from '~/lib/server/auth/sessions';

/** Signs out: the session ends on the server, not only in this browser. POST only (no sign-out by link). */
export const POST: APIRoute = async ({ locals, cookies, redirect }) => {
  if (locals.session) await endSession(locals.session.token);
  clearSessionCookie(cookies);
  return redirect('/login?notice=signed-out', 303);
};
