import type { AstroCookies } from 'astro';
import { getLucia } from './lucia';

// The only module that reads or writes the session cookie.

export function readSessionToken(cookies: AstroCookies): string | null {
  return cookies.get(getLucia().sessionCookieName)?.value || null;
}

export function setSessionCookie(cookies: AstroCookies, token: string): void {
  const cookie = getLucia().createSessionCookie(token);
  cookies.set(cookie.name, cookie.value, cookie.attributes);
}

export function clearSessionCookie(cookies: AstroCookies): void {
  const cookie = getLucia().createBlankSessionCookie();
  cookies.set(cookie.name, cookie.value, cookie.attributes);
}
