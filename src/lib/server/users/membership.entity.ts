import { Entity, ManyToOne, Property, Unique, type Opt } from '@mikro-orm/core';
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

  /** Whether the firm's new-inquiry e-mail reaches this person; on unless they opt out on their account page. */
  @Property({ type: 'boolean' })
  newInquiryMail: boolean & Opt = true;
}
