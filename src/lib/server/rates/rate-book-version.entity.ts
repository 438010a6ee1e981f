import { Entity, Index, Property, Unique, type Opt } from '@mikro-orm/core';
import { TenantEntity } from '../companies/tenant.entity';
import type { RateBookInput } from '~/lib/estimate';
import type { Envelope } from '../db/versioned-json';

export type RateBookStatus = 'draft' | 'published' | 'retired';

/**
 * One version of a firm's Rate book. Exactly one version per firm is published at a time; every
 * estimate records the version it was computed with, so old estimates stay explainable.
 */
@Entity({ tableName: 'rate_book_version' })
@Unique({ properties: ['company', 'number'] })
// At most one published version per firm, whatever races between two publishers.
@Index({
  name: 'rate_book_version_one_published',
  expression: `create unique index "rate_book_version_one_published" on "rate_book_version" ("company_id") where "status" = 'published'`,
})
export class RateBookVersion extends TenantEntity {
  /** 1, 2, 3 … per firm. */
  @Property({ type: 'integer' })
  number!: number;

  @Property({ type: 'string', length: 12 })
  status: RateBookStatus & Opt = 'draft';

  /** The owner's numbers, as validated by the estimating core's rate-book schema; read with `storedRateBook.read`. */
  @Property({ type: 'json' })
  data!: Envelope<RateBookInput>;

  @Property({ type: 'string', length: 200, nullable: true })
  note: string | null = null;

  @Property({ type: 'datetime', nullable: true })
  publishedAt: Date | null = null;
}
