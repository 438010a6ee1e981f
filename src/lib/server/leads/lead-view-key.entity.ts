import { Entity, Index, ManyToOne, Property, Unique } from '@mikro-orm/core';
import { TenantEntity } from '../companies/tenant.entity';
import type { Lead } from './lead.entity';

/**
 * A further key to the homeowner's private estimate link, minted for each e-mail staff send from
 * the inquiry page (the first key, from the confirmation, stays on the lead as `viewTokenHash`).
 * Only the key's SHA-256 is stored, as for the first one.
 */
@Entity({ tableName: 'lead_view_key' })
@Index({ properties: ['lead'] })
export class LeadViewKey extends TenantEntity {
  @ManyToOne({ entity: 'Lead', deleteRule: 'cascade' })
  lead!: Lead;

  @Property({ type: 'string', length: 64 })
  @Unique()
  keyHash!: string;
}
