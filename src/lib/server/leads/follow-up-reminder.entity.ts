import { Entity, Index, ManyToOne, Property } from '@mikro-orm/core';
import { TenantEntity } from '../companies/tenant.entity';
import type { User } from '../users/user.entity';
import type { Lead } from './lead.entity';

/**
 * A reminder e-mail owed when an inquiry's follow-up comes due. Setting a new follow-up replaces
 * the unsent one, clearing it removes it; `sentAt` is claimed once, so each goes out once.
 */
@Entity({ tableName: 'follow_up_reminder' })
@Index({ properties: ['dueAt'] })
export class FollowUpReminder extends TenantEntity {
  @ManyToOne({ entity: 'Lead', deleteRule: 'cascade', index: true })
  lead!: Lead;

  @Property({ type: 'datetime' })
  dueAt!: Date;

  /** Who set the follow-up: the reminder goes to them when the inquiry has no assignee. */
  @ManyToOne({ entity: 'User', deleteRule: 'set null', nullable: true })
  setBy: User | null = null;

  /** When the reminder was queued in the outbox (or passed over because the inquiry had moved on). */
  @Property({ type: 'datetime', nullable: true })
  sentAt: Date | null = null;
}
