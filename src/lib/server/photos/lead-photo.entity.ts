import { Entity, Index, ManyToOne, Property, type Opt } from '@mikro-orm/core';
import { TenantEntity } from '../companies/tenant.entity';
import type { Lead } from '../leads/lead.entity';

/** pending → checking (one request checks it, until `checkingUntil`) → ready or refused; back to pending if nothing arrived. */
export type PhotoStatus = 'pending' | 'checking' | 'ready' | 'refused';

/**
 * A homeowner's photo. Uploaded under a widget draft before the lead exists; attached to the lead
 * when it is sent. Only checked, re-encoded copies (metadata stripped) are ever shown.
 */
@Entity({ tableName: 'lead_photo' })
@Index({ properties: ['company', 'draftId'] })
export class LeadPhoto extends TenantEntity {
  @Property({ type: 'uuid' })
  draftId!: string;

  @ManyToOne({ entity: 'Lead', nullable: true, deleteRule: 'cascade', index: true })
  lead: Lead | null = null;

  @Property({ type: 'string', length: 12 })
  status: PhotoStatus & Opt = 'pending';

  /** Where the browser uploads the untouched file; deleted after the check. */
  @Property({ type: 'string', length: 200 })
  uploadKey!: string;

  /** The checked, re-encoded image and its thumbnail. */
  @Property({ type: 'string', length: 200, nullable: true })
  imageKey: string | null = null;

  @Property({ type: 'string', length: 200, nullable: true })
  thumbKey: string | null = null;

  @Property({ type: 'integer', nullable: true })
  width: number | null = null;

  @Property({ type: 'integer', nullable: true })
  height: number | null = null;

  @Property({ type: 'integer', nullable: true })
  bytes: number | null = null;

  /** The homeowner's own file name, for display only; never used in storage keys. */
  @Property({ type: 'string', length: 120 })
  originalName!: string;

  @Property({ type: 'string', length: 300, nullable: true })
  refusal: string | null = null;

  /** While `checking`: the request checking it has until then; after that another may take over. */
  @Property({ type: 'datetime', nullable: true })
  checkingUntil: Date | null = null;
}
