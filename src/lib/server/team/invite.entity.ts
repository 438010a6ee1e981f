import { Entity, ManyToOne, Property, Unique } from '@mikro-orm/core';
import { TenantEntity } from '../companies/tenant.entity';
import type { Role } from '../users/membership.entity';
import type { User } from '../users/user.entity';

/** An invitation to join a firm's team. Only a keyed digest of the link's token is stored. */
@Entity({ tableName: 'team_invite' })
export class Invite extends TenantEntity {
  /** Lower-cased, like User.email. */
  @Property({ type: 'string', length: 254 })
  email!: string;

  @Property({ type: 'string', length: 16 })
  role!: Role;

  @Property({ type: 'string', length: 64 })
  @Unique()
  tokenDigest!: string;

  @ManyToOne({ entity: 'User', nullable: true, deleteRule: 'set null' })
  invitedBy: User | null = null;

  @Property({ type: 'datetime' })
  expiresAt!: Date;

  /** Set when the link is used; a used link never works again. */
  @Property({ type: 'datetime', nullable: true })
  acceptedAt: Date | null = null;
}
