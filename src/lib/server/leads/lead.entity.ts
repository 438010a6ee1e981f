import { BeforeCreate, BeforeUpdate, Entity, Index, ManyToOne, Property, Unique, wrap, type Opt } from '@mikro-orm/core';
import { TenantEntity } from '../companies/tenant.entity';
import type { Estimate, ProjectInput } from '~/lib/estimate';
import type { Envelope } from '../db/versioned-json';
import type { RateBookVersion } from '../rates/rate-book-version.entity';
import type { Membership } from '../users/membership.entity';
import type { ContactMethod, LeadSource, LeadStage } from '~/lib/shared/labels';
import { finishFacts, searchTextOf } from './list-search';
import { responseDueAt } from './response-due';

/** A homeowner's inquiry: their inputs, the estimate they saw, how to reach them, where it stands. */
@Entity({ tableName: 'lead' })
@Unique({ properties: ['company', 'idempotencyKey'] })
@Index({ properties: ['company', 'createdAt'] })
@Index({ properties: ['company', 'email'] })
@Index({ properties: ['company', 'phone'] })
// The Inquiries list (inquiry-list.ts): keyset pages per firm in the orders people sort by most,
// and the trigram index its search uses. Deleted leads are never listed, so they are left out.
@Index({
  name: 'lead_list_received_index',
  expression: `create index "lead_list_received_index" on "lead" ("company_id", "created_at", "id") where "deleted_at" is null`,
})
@Index({
  name: 'lead_list_waiting_index',
  expression: `create index "lead_list_waiting_index" on "lead" ("company_id", coalesce("last_contact_at", "created_at"), "id") where "deleted_at" is null`,
})
@Index({
  name: 'lead_list_score_index',
  expression: `create index "lead_list_score_index" on "lead" ("company_id", "triage_score", "id") where "deleted_at" is null`,
})
@Index({
  name: 'lead_search_text_trgm_index',
  expression: `create index "lead_search_text_trgm_index" on "lead" using gin ("search_text" gin_trgm_ops) where "deleted_at" is null`,
})
export class Lead extends TenantEntity {
  /** Short code the homeowner and staff can read out on the phone (e.g. `K7MX-42QD`). */
  @Property({ type: 'string', length: 12 })
  @Unique()
  reference!: string;

  @Property({ type: 'string', length: 24 })
  stage: LeadStage & Opt = 'new';

  /** Where it came from: the price widget, or typed in by staff. */
  @Property({ type: 'string', length: 12 })
  source: LeadSource & Opt = 'widget';

  @Property({ type: 'string', length: 120 })
  name!: string;

  @Property({ type: 'string', length: 254 })
  email!: string;

  /** E.164, e.g. +15125550147. */
  @Property({ type: 'string', length: 20 })
  phone!: string;

  @Property({ type: 'string', length: 200 })
  address!: string;

  @Property({ type: 'string', length: 12 })
  postcode!: string;

  @Property({ type: 'string', length: 8 })
  preferredContact!: ContactMethod;

  @Property({ type: 'text', nullable: true })
  message: string | null = null;

  /** When the homeowner agreed to be contacted about this inquiry. */
  @Property({ type: 'datetime' })
  consentAt!: Date;

  /** The project exactly as the homeowner described it; read it with `leadInputs.read`. */
  @Property({ type: 'json' })
  inputs!: Envelope<ProjectInput>;

  /**
   * The estimate as shown to the homeowner (takeoff, price lines, range, cautions); read it with
   * `estimateSnapshot.read`. Lazy: lists of leads never load it.
   */
  @Property({ type: 'json', lazy: true })
  estimate!: Envelope<Estimate>;

  @ManyToOne({ entity: 'RateBookVersion', deleteRule: 'restrict' })
  rateBookVersion!: RateBookVersion;

  @Property({ type: 'integer' })
  rangeLowCents!: number;

  @Property({ type: 'integer' })
  rangeHighCents!: number;

  /** The client's key for this submission: a retried or double-tapped send makes one lead. */
  @Property({ type: 'string', length: 64 })
  idempotencyKey!: string;

  /**
   * SHA-256 of what was sent with that key, so the same key with a different body is refused
   * rather than silently answered with the first lead. Null for leads entered by staff.
   */
  @Property({ type: 'string', length: 64, nullable: true })
  requestDigest: string | null = null;

  /** The widget session the photos were uploaded under. */
  @Property({ type: 'uuid', nullable: true })
  draftId: string | null = null;

  /** Secret for the homeowner's private link to view the estimate later (stored hashed). */
  @Property({ type: 'string', length: 64, hidden: true })
  viewTokenHash!: string;

  /** The teammate working it; cleared when they leave the firm. */
  @ManyToOne({ entity: 'Membership', deleteRule: 'set null', nullable: true })
  assignee: Membership | null = null;

  /** When someone on the staff first opened it; until then it is unread. */
  @Property({ type: 'datetime', nullable: true })
  openedAt: Date | null = null;

  /** The first and the latest contact with the homeowner (a logged call, an e-mail sent). */
  @Property({ type: 'datetime', nullable: true })
  firstContactAt: Date | null = null;

  @Property({ type: 'datetime', nullable: true })
  lastContactAt: Date | null = null;

  @Property({ type: 'datetime', nullable: true })
  nextFollowUpAt: Date | null = null;

  /**
   * When the first contact is due by the firm's response target (working hours in its time zone);
   * with no first contact by then the inquiry is overdue. Set when the lead is created.
   */
  @Property({ type: 'datetime', nullable: true })
  responseDueAt: Date | null = null;

  /** Why it is not going ahead (from the firm's list), when it is not. */
  @Property({ type: 'string', length: 120, nullable: true })
  lostReason: string | null = null;

  /** Soft delete: hidden from every list, restorable by an owner until it is purged. */
  @Property({ type: 'datetime', nullable: true })
  deletedAt: Date | null = null;

  /** 0–100, higher is more promising; how it is worked out lives in `triage-score.ts`. */
  @Property({ type: 'smallint' })
  triageScore: number & Opt = 0;

  /** An open inquiry of the same firm with the same e-mail or phone when this one came in (see `duplicates.ts`). */
  @ManyToOne({ entity: 'Lead', deleteRule: 'set null', nullable: true })
  duplicateOf: Lead | null = null;

  /** Set when this inquiry was merged into another: its history moved there, and this row is kept as a pointer. */
  @ManyToOne({ entity: 'Lead', deleteRule: 'cascade', nullable: true })
  mergedInto: Lead | null = null;
  // What the Inquiries list shows and filters by, kept beside the lead so the list never reads the
  // estimate: set when the lead is stored (the hooks below), backfilled by the migration that added them.

  /** Lowercase name, e-mail, reference, street, postcode and phone digits (list-search.ts). */
  @Property({ type: 'text' })
  searchText: string & Opt = '';

  /** The finishes as the firm names them, e.g. "Beadboard wainscot, Shiplap". */
  @Property({ type: 'string', length: 200 })
  finishLabel: string & Opt = '';

  /** The estimating core's treatment kinds in the estimate (shiplap, beadboard, …). */
  @Property({ type: 'text[]', defaultRaw: `'{}'` })
  finishKinds: string[] & Opt = [];

  /** Net covered wall area of the estimate, square feet, rounded. */
  @Property({ type: 'integer' })
  coveredSqFt: number & Opt = 0;

  /** Photos that came with it. */
  @Property({ type: 'smallint' })
  photoCount: number & Opt = 0;

  @BeforeCreate()
  protected fillListFacts(): void {
    this.searchText = searchTextOf(this);
    const estimate = this.estimate?.data;
    if (estimate) {
      const finish = finishFacts(estimate.takeoff.rooms);
      this.finishLabel = finish.label;
      this.finishKinds = finish.kinds;
      this.coveredSqFt = Math.round(estimate.takeoff.netSqFt);
      this.photoCount = estimate.takeoff.facts.photoCount;
    }
    // The firm's target in its own working hours; a firm given only by id (tests) sets it itself.
    if (!this.responseDueAt && this.company && wrap(this.company).isInitialized()) {
      this.responseDueAt = responseDueAt(this.createdAt, this.company.timeZone, this.company.responseTargetMinutes);
    }
  }

  /** Contact details may be corrected later; the search follows them. */
  @BeforeUpdate()
  protected refreshSearchText(): void {
    this.searchText = searchTextOf(this);
  }
}
