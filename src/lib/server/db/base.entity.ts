import { randomUUID } from 'node:crypto';
import { ManyToOne, PrimaryKey, Property, type Opt } from '@mikro-orm/core';
import type { Company } from '../companies/company.entity';

/** Columns every table has. Every property names its type: esbuild emits no decorator metadata. */
export abstract class BaseEntity {
  @PrimaryKey({ type: 'uuid' })
  id: string = randomUUID();

  @Property({ type: 'datetime', defaultRaw: 'now()' })
  createdAt: Date & Opt = new Date();

  @Property({ type: 'datetime', defaultRaw: 'now()', onUpdate: () => new Date() })
  updatedAt: Date & Opt = new Date();
}

/**
 * A row that belongs to one firm. Every tenant-owned table extends this, so it carries
 * `company_id`, and every repository query filters on it.
 */
export abstract class TenantEntity extends BaseEntity {
  @ManyToOne({ entity: 'Company', deleteRule: 'cascade', index: true })
  company!: Company;
}
