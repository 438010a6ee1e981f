import { Entity, ManyToOne, Property, Unique } from '@mikro-orm/core';
import { BaseEntity } from '../db/base.entity';
import type { Company } from '../companies/company.entity';
import type { User } from '../users/user.entity';

/**
 * A signed-in browser. The cookie carries a random token; this row stores only its SHA-256 digest,
 * so a copy of the table cannot be replayed as cookies.
 */
@Entity({ tableName: 'user_session' })
export class Session extends BaseEntity {
  @Property({ type: 'string', length: 64 })
  @Unique()
  tokenDigest!: string;

  @ManyToOne({ entity: 'User', deleteRule: 'cascade', index: true })
  user!: User;

  /** The firm the person is working in; a person may belong to several. */
  @ManyToOne({ entity: 'Company', nullable: true, deleteRule: 'set null' })
  company: Company | null = null;

  /** Slides forward while the session is used. */
  @Property({ type: 'datetime' })
  expiresAt!: Date;

  /** Never moves: after this the person signs in again, however active. */
  @Property({ type: 'datetime' })
  absoluteExpiresAt!: Date;
}
