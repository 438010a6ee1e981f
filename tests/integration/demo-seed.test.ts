import { afterAll, beforeAll, expect, test } from 'vitest';
import type { MikroORM } from '@mikro-orm/postgresql';
import { getOrm } from '../../src/lib/server/boot/orm';
import { Company } from '../../src/lib/server/companies/company.entity';
import { Membership } from '../../src/lib/server/users/membership.entity';
import { User } from '../../src/lib/server/users/user.entity';
import { seedDemo } from '../../src/lib/server/demo-data/demo';

let orm: MikroORM;
beforeAll(async () => {
  orm = await getOrm();
});
afterAll(async () => {
  await orm.close();
});

test('the demo scenario has both firms and their people, and seeding again adds nothing', async () => {
  // `npm test` seeds the test database once before the tests run.
  expect(await seedDemo(orm.em.fork())).toBe('already present');
  const em = orm.em.fork();
  const firms = await em.find(Company, { slug: { $in: ['cedar-hollow', 'northgate'] } }, { orderBy: { slug: 'asc' } });
  expect(firms.map((f) => f.name)).toEqual(['Cedar Hollow Trim Co.', 'Northgate Wallworks']);
  const olive = await em.findOneOrFail(User, { email: 'olive@cedar-hollow.test' }, { populate: ['passwordHash'] });
  // Source: OWASP Password Storage Cheat Sheet minimum for argon2id (m=19456 KiB, t=2, p=1).
  expect(olive.passwordHash).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/);
  const roles = await em.find(Membership, { company: firms[0] }, { populate: ['user'], orderBy: { user: { email: 'asc' } } });
  expect(roles.map((m) => `${m.user.email}:${m.role}`)).toEqual([
    'olive@cedar-hollow.test:owner',
    'rhea@cedar-hollow.test:sales',
    'sam@cedar-hollow.test:sales',
  ]);
});
