import { Entity, ManyToOne, Property, Unique } from '@mikro-orm/core';
import { TenantEntity } from '../companies/tenant.entity';
import type { Membership } from '../users/membership.entity';

/**
 * "This person's morning digest for this day is queued." The unique pair makes a second run of the
 * job on the same day (two processes, a retry) queue nothing: the insert and the e-mail commit together.
 */
@Entity({ tableName: 'inquiry_digest' })
@Unique({ properties: ['membership', 'day'] })
export class InquiryDigest extends TenantEntity {
  @ManyToOne({ entity: 'Membership', deleteRule: 'cascade' })
  membership!: Membership;

  /** The calendar day in the firm's time zone, `YYYY-MM-DD`. */
  @Property({ type: 'string', length: 10 })
  day!: string;
}
