import { Entity, Index, Property, Unique } from '@mikro-orm/core';
import { TenantEntity } from '../companies/tenant.entity';

export const FUNNEL_STEPS = ['widget-opened', 'first-estimate', 'lead-sent'] as const;
export type FunnelStep = (typeof FUNNEL_STEPS)[number];

/** One step of a homeowner's path through the widget, counted per firm; no cookies, no tracking ids. */
@Entity({ tableName: 'funnel_event' })
@Index({ properties: ['company', 'step', 'createdAt'] })
@Unique({ properties: ['company', 'draftId', 'step'] })
export class FunnelEvent extends TenantEntity {
  @Property({ type: 'string', length: 20 })
  step!: FunnelStep;

  /** The widget draft, so one visit counts once per step. */
  @Property({ type: 'uuid' })
  draftId!: string;
}
