import { Entity, Property, Unique, type Opt } from '@mikro-orm/core';
import { BaseEntity } from '../db/base.entity';

/**
 * A contractor firm: the tenant. Everything a firm owns points back here. Units, currency and number
 * formatting belong to the firm's published Rate book, which prices every estimate.
 */
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

  /** Sites allowed to embed the price widget and call its API (origins like https://firm.example). */
  @Property({ type: 'json', defaultRaw: `'[]'` })
  embedOrigins: string[] & Opt = [];

  /** Who hears about new leads. */
  @Property({ type: 'json', defaultRaw: `'[]'` })
  notificationEmails: string[] & Opt = [];

  /** Postcodes (or their leading characters, e.g. "787") the firm serves; empty means anywhere. */
  @Property({ type: 'json', defaultRaw: `'[]'` })
  servicePostcodes: string[] & Opt = [];

  /** The firm's brand colour for the widget's primary action (#RRGGBB). */
  @Property({ type: 'string', length: 7 })
  brandColor: string & Opt = '#2F6B4F';

  /** Contact phone shown to homeowners in the widget and e-mails. */
  @Property({ type: 'string', length: 20, nullable: true })
  phone: string | null = null;

  /** Where a homeowner's reply reaches the firm (the Reply-To of mail sent in the firm's name). */
  @Property({ type: 'string', length: 254, nullable: true })
  contactEmail: string | null = null;

  // The office's postal address (Setup → Firm profile). Its postcode is also the centre of a
  // service area given as a radius.

  @Property({ type: 'string', length: 200, nullable: true })
  addressStreet: string | null = null;

  @Property({ type: 'string', length: 100, nullable: true })
  addressCity: string | null = null;

  /** State, province or county. */
  @Property({ type: 'string', length: 60, nullable: true })
  addressRegion: string | null = null;

  @Property({ type: 'string', length: 12, nullable: true })
  addressPostcode: string | null = null;

  /** Storage key of the firm's logo (`logos/<companyId>/<uuid>.png`, re-encoded by us), or none. */
  @Property({ type: 'string', length: 200, nullable: true })
  logoKey: string | null = null;

  /**
   * The service area as a radius in miles around the office's postcode; null means the area is the
   * postcode list (`servicePostcodes`) instead.
   */
  @Property({ type: 'smallint', nullable: true })
  serviceRadiusMiles: number | null = null;

  /** The firm's own website, shown in e-mails. */
  @Property({ type: 'string', length: 200, nullable: true })
  website: string | null = null;

  /**
   * How soon a new inquiry should get its first contact, in working minutes (Monday–Friday,
   * 08:00–17:00 in the firm's zone); later than that it is overdue. Default: four working hours.
   */
  @Property({ type: 'smallint' })
  responseTargetMinutes: number & Opt = 240;

  // Site visits (Setup → Visits). Product defaults, not trade figures: each firm sets its own.

  /** How long a site visit takes, in minutes. */
  @Property({ type: 'smallint' })
  visitMinutes: number & Opt = 60;

  /** Kept free after every visit for travel, in minutes (so also before the next one). */
  @Property({ type: 'smallint' })
  visitBufferMinutes: number & Opt = 30;

  /** Offered start times step this far apart from the start of each range, in minutes. */
  @Property({ type: 'smallint' })
  visitStepMinutes: number & Opt = 30;

  /** No visit may be booked to start sooner than this after booking, in minutes. */
  @Property({ type: 'integer' })
  visitMinNoticeMinutes: number & Opt = 1440;

  /** How many days ahead homeowners may book. */
  @Property({ type: 'smallint' })
  visitHorizonDays: number & Opt = 28;

  /** Whether the price widget offers homeowners a visit time after they send their inquiry. */
  @Property({ type: 'boolean' })
  onlineBooking: boolean & Opt = true;
}
