import type { EntityManager } from '@mikro-orm/postgresql';
import type { Mentionable } from '~/lib/shared/mentions';
import { Membership } from '../users/membership.entity';

export type FirmPerson = Mentionable & { email: string };

/** Everyone on the firm's team, by name: who a note may mention. Another firm's people never appear. */
export async function firmPeople(em: EntityManager, companyId: string): Promise<FirmPerson[]> {
  const members = await em.find(Membership, { company: companyId }, { populate: ['user'], orderBy: { user: { name: 'asc' } } });
  return members.map((m) => ({ userId: m.user.id, name: m.user.name, email: m.user.email }));
}
