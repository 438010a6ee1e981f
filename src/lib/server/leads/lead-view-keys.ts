import { createHash, randomBytes, timingSafeEqual } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import { LeadViewKey } from './lead-view-key.entity';
import type { Lead } from './lead.entity';

/** How the private link's keys are stored: their SHA-256, never the key. */
export const viewKeyDigest = (key: string): string => createHash('sha256').update(key).digest('hex');

/** 24 random bytes (192 bits), as for the first key: far beyond guessing. common practice, no source. */
export function newViewKey(): string {
  return randomBytes(24).toString('base64url');
}

/**
 * A further key to the homeowner's private link for this lead, stored (hashed) on the next flush.
 * Each e-mail staff send gets its own, so the confirmation's link and every earlier one keep working.
 */
export function mintViewKey(em: EntityManager, lead: Lead): string {
  const key = newViewKey();
  em.create(LeadViewKey, { company: lead.company, lead, keyHash: viewKeyDigest(key) });
  return key;
}

/** Whether `key` opens this lead: its first key (compared in constant time) or one minted since. */
export async function viewKeyOpens(em: EntityManager, lead: Lead, key: string): Promise<boolean> {
  const digest = viewKeyDigest(key);
  if (timingSafeEqual(Buffer.from(lead.viewTokenHash, 'hex'), Buffer.from(digest, 'hex'))) return true;
  // Looked up by the digest itself: the database compares hashes, never the key.
  return (await em.count(LeadViewKey, { lead, company: lead.company, keyHash: digest })) > 0;
}
