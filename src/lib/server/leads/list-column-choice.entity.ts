import { Entity, ManyToOne, Property, Unique } from '@mikro-orm/core';
import { TenantEntity } from '../companies/tenant.entity';
import type { InquiryColumn } from '~/lib/shared/inquiry-list';
import type { User } from '../users/user.entity';

/** Which columns of the Inquiries list one person keeps showing, in one firm. */
@Entity({ tableName: 'list_column_choice' })
@Unique({ properties: ['company', 'user'] })
export class ListColumnChoice extends TenantEntity {
  @ManyToOne({ entity: 'User', deleteRule: 'cascade' })
  user!: User;

  /** Column ids in the list's order (validated by `listColumnsSchema` on the way in). */
  @Property({ type: 'json' })
  columns!: InquiryColumn[];
}
