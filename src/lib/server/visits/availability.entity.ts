import { Entity, ManyToOne, Property, Unique, type Opt } from '@mikro-orm/core';
import { TenantEntity } from '../companies/tenant.entity';
import type { Membership } from '../users/membership.entity';
import type { WeeklyHours } from '~/lib/shared/visit-schemas';

/**
 * When one salesperson takes site visits: wall-clock ranges per weekday in the firm's zone, and
 * local dates off. One row per person in a firm; a person without one takes no visits.
 */
@Entity({ tableName: 'availability' })
export class Availability extends TenantEntity {
  @ManyToOne({ entity: 'Membership', deleteRule: 'cascade' })
  @Unique()
  membership!: Membership;

  /** `{ mon: [{ from: '09:00', to: '12:00' }, …], … }`, checked by `weeklyHoursSchema`. */
  @Property({ type: 'json', defaultRaw: `'{}'` })
  weekly: WeeklyHours & Opt = {};

  /** 'YYYY-MM-DD' dates in the firm's zone. */
  @Property({ type: 'json', defaultRaw: `'[]'` })
  daysOff: string[] & Opt = [];
}
