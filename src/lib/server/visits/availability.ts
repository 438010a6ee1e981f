/**
 * Each person's weekly hours and days off, read and replaced whole. A person without a row takes
 * no visits; saving creates the row.
 */
import { randomUUID } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import { isId } from '~/lib/shared/ids';
import type { AvailabilityInput } from '~/lib/shared/visit-schemas';
import type { AvailabilityView } from '~/lib/shared/visit-calendar';
import { NotFound } from '../errors';
import { Membership } from '../users/membership.entity';
import { Availability } from './availability.entity';

/** A membership of the firm with its person, or not found (another firm's id included). */
export async function membershipOfCompany(em: EntityManager, companyId: string, membershipId: string): Promise<Membership> {
  if (!isId(membershipId)) throw new NotFound('No such person on your team.');
  const membership = await em.findOne(Membership, { id: membershipId, company: companyId }, { populate: ['user'] });
  if (!membership) throw new NotFound('No such person on your team.');
  return membership;
}

export async function availabilityView(em: EntityManager, membership: Membership): Promise<AvailabilityView> {
  const row = await em.findOne(Availability, { company: membership.company.id, membership: membership.id });
  return { membershipId: membership.id, name: membership.user.name, weekly: row?.weekly ?? {}, daysOff: row?.daysOff ?? [] };
}

/** Replaces the person's hours and days off (already checked by `availabilitySchema`). */
export async function saveAvailability(em: EntityManager, membership: Membership, input: AvailabilityInput): Promise<AvailabilityView> {
  // Only the days that have ranges are kept, so "no hours on Saturday" is one spelling.
  const weekly = Object.fromEntries(Object.entries(input.weekly).filter(([, ranges]) => ranges && ranges.length > 0));
  // One statement, so two saves at once cannot both try to create the person's row.
  await em.getConnection().execute(
    `insert into "availability" ("id", "company_id", "membership_id", "weekly", "days_off") values (?, ?, ?, ?::jsonb, ?::jsonb)
     on conflict ("membership_id") do update set "weekly" = excluded."weekly", "days_off" = excluded."days_off", "updated_at" = now()`,
    [randomUUID(), membership.company.id, membership.id, JSON.stringify(weekly), JSON.stringify(input.daysOff)],
  );
  return { membershipId: membership.id, name: membership.user.name, weekly, daysOff: input.daysOff };
}
