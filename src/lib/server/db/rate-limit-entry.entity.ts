import { Entity, PrimaryKey, Property, type Opt } from '@mikro-orm/core';

/**
 * The table `rate-limiter-flexible` keeps its counters in (see ../rate-limit.ts). Declared as an
 * entity only so the migrations own the table and the schema check sees no drift; the app never
 * reads it through the ORM. The columns are exactly the ones that library's PostgreSQL store creates.
 */
@Entity({ tableName: 'rate_limit' })
export class RateLimitEntry {
  @PrimaryKey({ type: 'string', length: 255 })
  key!: string;

  @Property({ type: 'integer', default: 0 })
  points: number & Opt = 0;

  /** Milliseconds since the epoch; null means the counter never resets. */
  @Property({ type: 'bigint', nullable: true })
  expire: string | null = null;
}
