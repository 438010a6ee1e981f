import { Entity, Property, Unique, type Opt } from '@mikro-orm/core';
import { TenantEntity } from '../db/base.entity';
import type { RateBookInput } from '../../estimate';

export type RateBookStatus = 'draft' | 'published' | 'retired';

/**
 * One version of a firm's Rate book. Exactly one version per firm is published at a time; every
 * estimate records the version it was computed with, so old estimates stay explainable.
 */
@Entity({ tableName: 'rate_book_version' })
@Unique({ properties: ['company', 'number'] })
export class RateBookVersion extends TenantEntity {
  /** 1, 2, 3 … per firm. */
  @Property({ type: 'integer' })
  number!: number;

  @Property({ type: 'string', length: 12 })
  status: RateBookStatus & Opt = 'draft';

  /** The owner's numbers, as validated by the estimating core's rate-book schema. */
  @Property({ type: 'json' })
  data!: RateBookInput;

  @Property({ type: 'string', length: 200, nullable: true })
  note: string | null = null;

  @Property({ type: 'datetime', nullable: true })
  publishedAt: Date | null = null;
}
