import { Entity, ManyToOne, Property, type Opt } from '@mikro-orm/core';
import { TenantEntity } from '../companies/tenant.entity';
import type { RateBookVersion } from '../rates/rate-book-version.entity';
import type { ReplaySummary } from './replay-summary';

export type ReplayStatus = 'queued' | 'running' | 'done' | 'failed';

/**
 * One replay of a firm's recent inquiries under a draft revision: its progress while the job runs,
 * then its summary. A newer revision of the draft needs a new replay; old ones go with the draft.
 */
@Entity({ tableName: 'rate_book_replay' })
export class RateBookReplay extends TenantEntity {
  @ManyToOne({ entity: 'RateBookVersion', deleteRule: 'cascade', index: true })
  draft!: RateBookVersion;

  /** The draft's revision the replay priced with. */
  @Property({ type: 'integer' })
  draftRevision!: number;

  @Property({ type: 'string', length: 10 })
  status: ReplayStatus & Opt = 'queued';

  @Property({ type: 'integer' })
  total!: number;

  @Property({ type: 'integer' })
  done: number & Opt = 0;

  @Property({ type: 'json', nullable: true })
  summary: ReplaySummary | null = null;

  @Property({ type: 'string', length: 300, nullable: true })
  failure: string | null = null;
}
