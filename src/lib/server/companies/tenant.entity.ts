import { ManyToOne } from '@mikro-orm/core';
import { BaseEntity } from '../db/base.entity';
import type { Company } from './company.entity';

/**
 * A row that belongs to one firm. Every tenant-owned table extends this, so it carries
 * `company_id`, and every repository query filters on it.
 */
export abstract class TenantEntity extends BaseEntity {
  @ManyToOne({ entity: 'Company', deleteRule: 'cascade', index: true })
  company!: Company;
}
