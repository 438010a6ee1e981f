import { Entity, Property, Unique, type Opt } from '@mikro-orm/core';
import { BaseEntity } from '../db/base.entity';

export type Units = 'imperial' | 'metric';

/** A contractor firm: the tenant. Everything a firm owns points back here. */
@Entity({ tableName: 'company' })
export class Company extends BaseEntity {
  /** The firm's short name in URLs (`/embed/cedar-hollow`). */
  @Property({ type: 'string', length: 60 })
  @Unique()
  slug!: string;

  @Property({ type: 'string', length: 120 })
  name!: string;

  /** IANA time zone, for visit slots and dates shown to staff. */
  @Property({ type: 'string', length: 64 })
  timeZone: string & Opt = 'America/New_York';

  /** ISO 4217 currency code; money is stored in integer minor units (cents). */
  @Property({ type: 'string', length: 3 })
  currency: string & Opt = 'USD';

  /** Lengths shown and typed in inches and feet, or in millimetres and metres. */
  @Property({ type: 'string', length: 8 })
  units: Units & Opt = 'imperial';

  /** BCP 47 locale for number and money formatting. */
  @Property({ type: 'string', length: 16 })
  locale: string & Opt = 'en-US';
}
