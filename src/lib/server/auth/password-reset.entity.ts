import { Entity, ManyToOne, Property, Unique } from '@mikro-orm/core';
import { BaseEntity } from '../db/base.entity';
import type { User } from '../users/user.entity';

/** A pending "choose a new password" link. Only a keyed digest of the link's token is stored. */
@Entity({ tableName: 'password_reset' })
export class PasswordReset extends BaseEntity {
  @ManyToOne({ entity: 'User', deleteRule: 'cascade', index: true })
  user!: User;

  @Property({ type: 'string', length: 64 })
  @Unique()
  tokenDigest!: string;

  @Property({ type: 'datetime' })
  expiresAt!: Date;

  /** Set when the link is used; a used link never works again. */
  @Property({ type: 'datetime', nullable: true })
  usedAt: Date | null = null;
}
