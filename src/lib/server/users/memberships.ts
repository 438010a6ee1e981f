import type { EntityManager } from '@mikro-orm/postgresql';
import type { ActiveMembership } from './types';
import { Membership } from './membership.entity';

/** Every firm a person belongs to, with their role in each, by firm name. */
export async function listFirmsOfUser(em: EntityManager, userId: string): Promise<ActiveMembership[]> {
  const rows = await em.find(Membership, { user: userId }, { populate: ['company'], orderBy: { company: { name: 'asc' } } });
  return rows.map((m) => ({ id: m.id, companyId: m.company.id, companyName: m.company.name, companySlug: m.company.slug, role: m.role }));
}
