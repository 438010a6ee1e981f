import { Entity, Property, Unique } from '@mikro-orm/core';
import { TenantEntity } from '../companies/tenant.entity';

/**
 * The firm's own list of reasons an inquiry is not going ahead, in the order the picker shows
 * them. One row per firm, written the first time the owner saves the list; until then the firm
 * uses `DEFAULT_LOST_REASONS`. Inquiries keep the reason's words, so editing the list never
 * rewrites an inquiry's history.
 */
@Entity({ tableName: 'lost_reason_list' })
@Unique({ properties: ['company'] })
export class LostReasonList extends TenantEntity {
  @Property({ type: 'json' })
  reasons!: string[];
}
