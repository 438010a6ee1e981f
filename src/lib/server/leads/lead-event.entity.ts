import { Entity, Index, ManyToOne, Property, type Opt } from '@mikro-orm/core';
import { TenantEntity } from '../companies/tenant.entity';
import type { LeadEventKind } from '~/lib/shared/lead-events';
import type { User } from '../users/user.entity';
import type { Lead } from './lead.entity';

/**
 * One thing that happened to an inquiry: the timeline is these rows in time order. What each kind
 * carries in `data` is written down beside the code that records it (`lead-events.ts`).
 */
@Entity({ tableName: 'lead_event' })
@Index({ properties: ['lead', 'at'] })
export class LeadEvent extends TenantEntity {
  @ManyToOne({ entity: 'Lead', deleteRule: 'cascade' })
  lead!: Lead;

  @Property({ type: 'string', length: 24 })
  kind!: LeadEventKind;

  /** Who did it; null for the homeowner and for the app itself. */
  @ManyToOne({ entity: 'User', deleteRule: 'set null', nullable: true })
  actor: User | null = null;

  @Property({ type: 'datetime' })
  at!: Date;

  @Property({ type: 'json' })
  data: Record<string, unknown> & Opt = {};

  /** Set when someone undid it (a stage move, an assignment); the row stays in the history. */
  @Property({ type: 'datetime', nullable: true })
  undoneAt: Date | null = null;

  @ManyToOne({ entity: 'User', deleteRule: 'set null', nullable: true })
  undoneBy: User | null = null;
}
