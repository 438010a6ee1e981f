import { Entity, Property, Unique } from '@mikro-orm/core';
import { BaseEntity } from '../db/base.entity';

/** A person who signs in to the staff area. Homeowners never get one. */
@Entity({ tableName: 'app_user' })
export class User extends BaseEntity {
  /** Stored lower-cased and trimmed, so sign-in is case-insensitive. */
  @Property({ type: 'string', length: 254 })
  @Unique()
  email!: string;

  @Property({ type: 'string', length: 120 })
  name!: string;

  /** argon2id hash; null until the person sets a password from an invite. */
  @Property({ type: 'string', length: 255, nullable: true, hidden: true, lazy: true })
  passwordHash: string | null = null;
}
