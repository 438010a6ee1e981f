import { createHash, createHmac, randomBytes } from 'node:crypto';
import { config } from '../config';

/**
 * A fresh secret for a link (invite, password reset): 160 random bits, base64url.
 * Source: the Copenhagen Book, "Server-side tokens": at least 112 bits of entropy from a CSPRNG.
 */
export function newLinkToken(): string {
  return randomBytes(20).toString('base64url');
}

/**
 * What the database stores for a link token: an HMAC-SHA256 under APP_SECRET, bound to its purpose.
 * A copy of the table cannot be turned back into working links, and without the app's secret no
 * one can make a token that matches a row, so only links this installation signed ever work.
 */
export function linkTokenDigest(purpose: 'invite' | 'password-reset', token: string): string {
  return createHmac('sha256', config.appSecret).update(`${purpose}:${token}`).digest('hex');
}

/**
 * What the database stores for a session token: its SHA-256. The token already has 200 random bits,
 * so a plain hash is enough (Source: the Copenhagen Book, "Server-side tokens": hash tokens before
 * storage).
 */
export function sessionTokenDigest(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

/** A link token has this shape; anything else is refused before any database lookup. */
export function looksLikeLinkToken(token: string | undefined): token is string {
  return typeof token === 'string' && /^[A-Za-z0-9_-]{27}$/.test(token);
}
