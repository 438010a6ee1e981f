import { Entity, ManyToOne, Property, Unique } from '@mikro-orm/core';
import { TenantEntity } from '../companies/tenant.entity';
import type { StaffRole } from '~/lib/shared/labels';
import type { User } from './user.entity';

export type Role = StaffRole;

/** A person's place in one firm. A person may belong to several firms, with a role in each. */
@Entity({ tableName: 'membership' })
@Unique({ properties: ['company', 'user'] })
export class Membership extends TenantEntity {
  @ManyToOne({ entity: 'User', deleteRule: 'cascade', index: true })
  user!: User;

  @Property({ type: 'string', length: 16 })
  role!: Role;
}
