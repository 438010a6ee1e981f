import { afterAll, beforeAll, expect, test } from 'vitest';
import type { MikroORM } from '@mikro-orm/postgresql';
import { getOrm } from '../../src/lib/server/boot/orm';
import { Company } from '../../src/lib/server/companies/company.entity';
import { Membership } from '../../src/lib/server/users/membership.entity';
import { User } from '../../src/lib/server/users/user.entity';
import { seedDemo } from '../../src/lib/server/demo-data/demo';
import { Availability } from '../../src/lib/server/visits/availability.entity';
import { Visit } from '../../src/lib/server/visits/visit.entity';
import { Lead } from '../../src/lib/server/leads/lead.entity';
import { LeadEvent } from '../../src/lib/server/leads/lead-event.entity';
import { estimateSnapshot } from '../../src/lib/server/estimates/estimate-snapshot';

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

test('the demo firms take visits: weekly hours, a day off next week, and visits that never overlap', async () => {
  const em = orm.em.fork();
  const cedar = await em.findOneOrFail(Company, { slug: 'cedar-hollow' });
  const hours = await em.find(Availability, { company: cedar }, { populate: ['membership.user'] });
  const sam = hours.find((h) => h.membership.user.email === 'sam@cedar-hollow.test')!;
  expect(sam.weekly.mon).toEqual([
    { from: '08:30', to: '12:00' },
    { from: '13:00', to: '17:00' },
  ]);
  expect(sam.weekly.sat).toBeUndefined();
  expect(sam.daysOff).toHaveLength(1);
  expect(hours.find((h) => h.membership.user.email === 'olive@cedar-hollow.test')!.weekly).toEqual({
    tue: [{ from: '13:00', to: '17:00' }],
    thu: [{ from: '13:00', to: '17:00' }],
  });

  for (const slug of ['cedar-hollow', 'northgate']) {
    const visits = await em.find(Visit, { company: { slug }, status: { $ne: 'cancelled' } }, { orderBy: { startsAt: 'asc' } });
    expect(visits.length).toBeGreaterThan(1);
    // No two live visits of one person touch, travel time after each included (half-open ranges).
    for (const [i, a] of visits.entries()) {
      for (const b of visits.slice(i + 1)) {
        if (a.salesperson?.id !== b.salesperson?.id) continue;
        expect(a.blockedUntil.getTime() <= b.startsAt.getTime() || b.blockedUntil.getTime() <= a.startsAt.getTime()).toBe(true);
      }
    }
    // Every booked visit is ahead, on an inquiry waiting for it at Visit booked.
    for (const visit of visits.filter((v) => v.status === 'booked')) {
      const lead = await em.findOneOrFail(Lead, { id: visit.lead.id });
      expect(visit.startsAt.getTime()).toBeGreaterThan(Date.now());
      expect(lead.stage).toBe('visit-booked');
      expect(lead.assignee).not.toBeNull();
    }
    // One visit done last week, on an inquiry at Measured, re-priced as a site measurement with the earlier range kept.
    const done = visits.filter((v) => v.status === 'done');
    expect(done).toHaveLength(1);
    expect(done[0]!.startsAt.getTime()).toBeGreaterThan(Date.now() - 9 * 86_400_000);
    expect(done[0]!.endsAt.getTime()).toBeLessThan(Date.now() - 2 * 86_400_000);
    const measured = await em.findOneOrFail(Lead, { id: done[0]!.lead.id }, { populate: ['estimate'] });
    expect(measured.stage).toBe('measured');
    expect(estimateSnapshot.read(measured.estimate).takeoff.facts.measuredBy).toBe('site-measure');
    const repriced = await em.findOneOrFail(LeadEvent, { lead: measured, kind: 're-estimated' });
    expect(repriced.data.after).toEqual({ lowCents: measured.rangeLowCents, highCents: measured.rangeHighCents });
  }
});
