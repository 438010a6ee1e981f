import type { EntityManager } from '@mikro-orm/postgresql';
import type { ActiveMembership } from './types';
import { Membership } from './membership.entity';

/**
 * The zone to write a person's times in when no one firm is in question (a password reset): their
 * firm's zone, or UTC when they belong to firms that keep different time (or to none).
 */
export async function timeZoneOfUser(em: EntityManager, userId: string): Promise<string> {
  const rows = await em.find(Membership, { user: userId }, { populate: ['company'] });
  const zones = new Set(rows.map((m) => m.company.timeZone));
  return zones.size === 1 ? [...zones][0]! : 'UTC';
}

/** Every firm a person belongs to, with their role in each, by firm name. */
export async function listFirmsOfUser(em: EntityManager, userId: string): Promise<ActiveMembership[]> {
  const rows = await em.find(Membership, { user: userId }, { populate: ['company'], orderBy: { company: { name: 'asc' } } });
  return rows.map((m) => ({ id: m.id, companyId: m.company.id, companyName: m.company.name, companySlug: m.company.slug, role: m.role }));
}
