import { randomUUID } from 'node:crypto';
import { PrimaryKey, Property, type Opt } from '@mikro-orm/core';

/**
 * Columns every table has. Every property names its type: esbuild emits no decorator metadata.
 * This folder is the ground floor: it imports no domain of ours.
 */
export abstract class BaseEntity {
  @PrimaryKey({ type: 'uuid' })
  id: string = randomUUID();

  @Property({ type: 'datetime', defaultRaw: 'now()' })
  createdAt: Date & Opt = new Date();

  @Property({ type: 'datetime', defaultRaw: 'now()', onUpdate: () => new Date() })
  updatedAt: Date & Opt = new Date();
}
