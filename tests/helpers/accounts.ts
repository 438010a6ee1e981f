import { randomBytes } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import { Company } from '../../src/lib/server/companies/company.entity';
import { Membership, type Role } from '../../src/lib/server/users/membership.entity';
import { hashPassword } from '../../src/lib/server/users/password';
import { User } from '../../src/lib/server/users/user.entity';

/** A firm of its own for one test file, so tests running side by side never share rows. */
export async function buildFirm(em: EntityManager, people: { name: string; role: Role; password?: string }[], firm: { timeZone?: string } = {}) {
  const tag = randomBytes(4).toString('hex');
  const company = em.create(Company, { slug: `test-${tag}`, name: `Test Firm ${tag}`, ...(firm.timeZone ? { timeZone: firm.timeZone } : {}) });
  const members: { user: User; membership: Membership; email: string; password: string }[] = [];
  for (const person of people) {
    const email = `${person.name.toLowerCase()}-${tag}@firm.test`;
    const password = person.password ?? `a long test password ${tag}`;
    const user = em.create(User, { email, name: person.name, passwordHash: await hashPassword(password) });
    const membership = em.create(Membership, { company, user, role: person.role });
    members.push({ user, membership, email, password });
  }
  await em.flush();
  return { company, members, tag };
}

/** The token at the end of a link like ORIGIN/invite/TOKEN in an e-mail's text. */
export function linkToken(text: string, kind: 'invite' | 'reset'): string {
  const match = text.match(new RegExp(`/${kind}/([A-Za-z0-9_-]+)`));
  if (!match) throw new Error(`No ${kind} link in:\n${text}`);
  return match[1];
}
