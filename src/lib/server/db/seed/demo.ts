// The invented demo scenario: two firms on one installation, so tenant isolation shows.
// Only the start command seeds this; no production path imports it.
import type { EntityManager } from '@mikro-orm/postgresql';
import { Company } from '../../companies/company.entity';
import { Membership, type Role } from '../../users/membership.entity';
import { User } from '../../users/user.entity';
import { hashPassword } from '../../users/password';

export const DEMO_PASSWORD = 'lapwing-demo-2026';

type DemoFirm = {
  slug: string;
  name: string;
  timeZone: string;
  people: { email: string; name: string; role: Role }[];
};

export const DEMO_FIRMS: DemoFirm[] = [
  {
    slug: 'cedar-hollow',
    name: 'Cedar Hollow Trim Co.',
    timeZone: 'America/Chicago',
    people: [
      { email: 'olive@cedar-hollow.test', name: 'Olive Marten', role: 'owner' },
      { email: 'sam@cedar-hollow.test', name: 'Sam Okafor', role: 'sales' },
      { email: 'rhea@cedar-hollow.test', name: 'Rhea Lindqvist', role: 'sales' },
    ],
  },
  {
    slug: 'northgate',
    name: 'Northgate Wallworks',
    timeZone: 'America/New_York',
    people: [{ email: 'nora@northgate.test', name: 'Nora Beaumont', role: 'owner' }],
  },
];

/** Adds whatever part of the demo scenario is missing; running it twice changes nothing. */
export async function seedDemo(em: EntityManager): Promise<string> {
  let created = 0;
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  for (const firm of DEMO_FIRMS) {
    let company = await em.findOne(Company, { slug: firm.slug });
    if (!company) {
      company = em.create(Company, { slug: firm.slug, name: firm.name, timeZone: firm.timeZone });
      created++;
    }
    for (const person of firm.people) {
      let user = await em.findOne(User, { email: person.email });
      if (!user) {
        user = em.create(User, { email: person.email, name: person.name, passwordHash });
        created++;
      }
      const membership = await em.findOne(Membership, { company, user });
      if (!membership) {
        em.create(Membership, { company, user, role: person.role });
        created++;
      }
    }
  }
  await em.flush();
  return created ? `${created} rows added` : 'already present';
}
