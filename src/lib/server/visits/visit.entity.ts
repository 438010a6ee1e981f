import { Check, Entity, Index, ManyToOne, Property, type Opt } from '@mikro-orm/core';
import { TenantEntity } from '../companies/tenant.entity';
import type { Lead } from '../leads/lead.entity';
import type { Membership } from '../users/membership.entity';
import type { User } from '../users/user.entity';
import type { VisitBookedVia, VisitCancelledBy, VisitStatus } from '~/lib/shared/visit-schemas';

/**
 * A site visit to measure an inquiry's rooms. While it is not cancelled, its salesperson is busy
 * from `startsAt` to `blockedUntil` (the end plus the firm's travel buffer); the database refuses
 * a second live visit of the same person overlapping that range (`visit_no_overlap`).
 */
@Entity({ tableName: 'visit' })
@Index({ properties: ['company', 'startsAt'], name: 'visit_company_starts_index' })
@Index({
  name: 'visit_reminder_due_index',
  expression: `create index "visit_reminder_due_index" on "visit" ("reminder_due_at") where "reminder_sent_at" is null and "status" = 'booked'`,
})
@Index({
  name: 'visit_no_overlap',
  expression: `alter table "visit" add constraint "visit_no_overlap" exclude using gist ("salesperson_id" with =, tstzrange("starts_at", "blocked_until", '[)') with &&) where ("status" <> 'cancelled')`,
})
@Check({ name: 'visit_times_check', expression: '"ends_at" > "starts_at" and "blocked_until" >= "ends_at"' })
export class Visit extends TenantEntity {
  @ManyToOne({ entity: 'Lead', deleteRule: 'cascade', index: true })
  lead!: Lead;

  /** Who goes. Null only after that person left the firm (the visit stays on the calendar). */
  @ManyToOne({ entity: 'Membership', deleteRule: 'set null', nullable: true })
  salesperson: Membership | null = null;

  @Property({ type: 'datetime' })
  startsAt!: Date;

  @Property({ type: 'datetime' })
  endsAt!: Date;

  /** `endsAt` plus the firm's travel buffer when booked: the end of the range no other visit may touch. */
  @Property({ type: 'datetime' })
  blockedUntil!: Date;

  @Property({ type: 'string', length: 12 })
  status: VisitStatus & Opt = 'booked';

  /** RFC 5545 SEQUENCE of the invitation: 0 when booked, one more on every change or cancellation. */
  @Property({ type: 'integer' })
  sequence: number & Opt = 0;

  @Property({ type: 'string', length: 16 })
  bookedVia!: VisitBookedVia;

  /** The staff member who booked it (null when the homeowner did). */
  @ManyToOne({ entity: 'User', deleteRule: 'set null', nullable: true })
  bookedBy: User | null = null;

  /** What the homeowner or staff noted for the visit (parking, gate code, which rooms). */
  @Property({ type: 'string', length: 500, nullable: true })
  note: string | null = null;

  @Property({ type: 'datetime', nullable: true })
  cancelledAt: Date | null = null;

  @Property({ type: 'string', length: 16, nullable: true })
  cancelledBy: VisitCancelledBy | null = null;

  /** When it was marked done or no-show. */
  @Property({ type: 'datetime', nullable: true })
  outcomeAt: Date | null = null;

  /** When the day-before reminder is due; moved with the visit. */
  @Property({ type: 'datetime', nullable: true })
  reminderDueAt: Date | null = null;

  /** Claimed once by the reminder job, so the reminder never goes out twice. Cleared when the visit moves. */
  @Property({ type: 'datetime', nullable: true })
  reminderSentAt: Date | null = null;
}
