import { Migration } from '@mikro-orm/migrations';

/**
 * Site visits. Each salesperson's weekly hours and days off (`availability`), the firm's visit
 * settings, and the visits themselves. No salesperson can hold two visits whose times (each
 * widened by the firm's travel buffer after it) overlap: an exclusion constraint says so, so two
 * bookings racing for one slot cannot both commit, whatever the application checked first.
 * Mail in the outbox may carry one calendar file (RFC 5545) for the invitations.
 */
export class Migration20261203170000_visits extends Migration {
  override async up(): Promise<void> {
    this.addSql(`create extension if not exists btree_gist;`);

    this.addSql(`alter table "company"
      add column "visit_minutes" smallint not null default 60,
      add column "visit_buffer_minutes" smallint not null default 30,
      add column "visit_step_minutes" smallint not null default 30,
      add column "visit_min_notice_minutes" integer not null default 1440,
      add column "visit_horizon_days" smallint not null default 28,
      add column "online_booking" boolean not null default true;`);

    this.addSql(`create table "availability" (
      "id" uuid not null,
      "created_at" timestamptz not null default now(),
      "updated_at" timestamptz not null default now(),
      "company_id" uuid not null,
      "membership_id" uuid not null,
      "weekly" jsonb not null default '{}',
      "days_off" jsonb not null default '[]',
      constraint "availability_pkey" primary key ("id"));`);
    this.addSql(`create index "availability_company_id_index" on "availability" ("company_id");`);
    this.addSql(`alter table "availability" add constraint "availability_membership_id_unique" unique ("membership_id");`);
    this.addSql(
      `alter table "availability" add constraint "availability_company_id_foreign" foreign key ("company_id") references "company" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "availability" add constraint "availability_membership_id_foreign" foreign key ("membership_id") references "membership" ("id") on update cascade on delete cascade;`,
    );

    this.addSql(`create table "visit" (
      "id" uuid not null,
      "created_at" timestamptz not null default now(),
      "updated_at" timestamptz not null default now(),
      "company_id" uuid not null,
      "lead_id" uuid not null,
      "salesperson_id" uuid null,
      "starts_at" timestamptz not null,
      "ends_at" timestamptz not null,
      "blocked_until" timestamptz not null,
      "status" varchar(12) not null default 'booked',
      "sequence" integer not null default 0,
      "booked_via" varchar(16) not null,
      "booked_by_id" uuid null,
      "note" varchar(500) null,
      "cancelled_at" timestamptz null,
      "cancelled_by" varchar(16) null,
      "outcome_at" timestamptz null,
      "reminder_due_at" timestamptz null,
      "reminder_sent_at" timestamptz null,
      constraint "visit_pkey" primary key ("id"),
      constraint "visit_times_check" check ("ends_at" > "starts_at" and "blocked_until" >= "ends_at"));`);
    this.addSql(`create index "visit_company_id_index" on "visit" ("company_id");`);
    this.addSql(`create index "visit_lead_id_index" on "visit" ("lead_id");`);
    this.addSql(`create index "visit_company_starts_index" on "visit" ("company_id", "starts_at");`);
    this.addSql(`create index "visit_reminder_due_index" on "visit" ("reminder_due_at") where "reminder_sent_at" is null and "status" = 'booked';`);
    this.addSql(
      `alter table "visit" add constraint "visit_company_id_foreign" foreign key ("company_id") references "company" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(`alter table "visit" add constraint "visit_lead_id_foreign" foreign key ("lead_id") references "lead" ("id") on update cascade on delete cascade;`);
    this.addSql(
      `alter table "visit" add constraint "visit_salesperson_id_foreign" foreign key ("salesperson_id") references "membership" ("id") on update cascade on delete set null;`,
    );
    this.addSql(
      `alter table "visit" add constraint "visit_booked_by_id_foreign" foreign key ("booked_by_id") references "app_user" ("id") on update cascade on delete set null;`,
    );
    // The guarantee against double booking: one salesperson, no two live visits whose
    // [start, end + buffer) ranges overlap. Half-open, so back-to-back visits are allowed.
    this.addSql(`alter table "visit" add constraint "visit_no_overlap" exclude using gist (
      "salesperson_id" with =, tstzrange("starts_at", "blocked_until", '[)') with &&) where ("status" <> 'cancelled');`);

    this.addSql(`alter table "mail_outbox" add column "calendar" jsonb null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "mail_outbox" drop column if exists "calendar";`);
    this.addSql(`drop table if exists "visit" cascade;`);
    this.addSql(`drop table if exists "availability" cascade;`);
    this.addSql(`alter table "company"
      drop column if exists "visit_minutes",
      drop column if exists "visit_buffer_minutes",
      drop column if exists "visit_step_minutes",
      drop column if exists "visit_min_notice_minutes",
      drop column if exists "visit_horizon_days",
      drop column if exists "online_booking";`);
  }
}
