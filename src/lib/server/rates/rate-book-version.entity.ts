import { Entity, Index, ManyToOne, Property, Unique, type Opt } from '@mikro-orm/core';
import { TenantEntity } from '../companies/tenant.entity';
import type { RateBookInput } from '~/lib/estimate';
import type { Envelope } from '../db/versioned-json';
import type { User } from '../users/user.entity';

export type RateBookStatus = 'draft' | 'published' | 'retired';

/**
 * One version of a firm's Rate book. Exactly one version per firm is published at a time and at most
 * one is a draft; every estimate records the version it was computed with, so old estimates stay
 * explainable. Once a version leaves the draft state its numbers never change: the database refuses
 * it (trigger `rate_book_version_frozen`, migration 20261204100000), whatever code asks.
 */
@Entity({ tableName: 'rate_book_version' })
@Unique({ properties: ['company', 'number'] })
// At most one published version per firm, whatever races between two publishers.
@Index({
  name: 'rate_book_version_one_published',
  expression: `create unique index "rate_book_version_one_published" on "rate_book_version" ("company_id") where "status" = 'published'`,
})
@Index({
  name: 'rate_book_version_one_draft',
  expression: `create unique index "rate_book_version_one_draft" on "rate_book_version" ("company_id") where "status" = 'draft'`,
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

  /** When a newer version replaced it as the published one. */
  @Property({ type: 'datetime', nullable: true })
  retiredAt: Date | null = null;

  /** Raised by every save of a draft; a save names the revision it started from (see rate-book-drafts.ts). */
  @Property({ type: 'integer', default: 1 })
  revision: number & Opt = 1;

  /** The version this draft was copied from, by number. */
  @Property({ type: 'integer', nullable: true })
  basedOnNumber: number | null = null;

  @ManyToOne({ entity: 'User', deleteRule: 'set null', nullable: true })
  createdBy: User | null = null;

  @ManyToOne({ entity: 'User', deleteRule: 'set null', nullable: true })
  updatedBy: User | null = null;

  @ManyToOne({ entity: 'User', deleteRule: 'set null', nullable: true })
  publishedBy: User | null = null;
}
