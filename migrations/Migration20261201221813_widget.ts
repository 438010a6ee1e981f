import { Migration } from '@mikro-orm/migrations';

export class Migration20261201221813_widget extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "funnel_event" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "company_id" uuid not null, "step" varchar(20) not null, "draft_id" uuid not null, constraint "funnel_event_pkey" primary key ("id"));`);
    this.addSql(`create index "funnel_event_company_id_index" on "funnel_event" ("company_id");`);
    this.addSql(`create index "funnel_event_company_id_step_created_at_index" on "funnel_event" ("company_id", "step", "created_at");`);
    this.addSql(`alter table "funnel_event" add constraint "funnel_event_company_id_draft_id_step_unique" unique ("company_id", "draft_id", "step");`);

    this.addSql(`create table "rate_book_version" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "company_id" uuid not null, "number" int not null, "status" varchar(12) not null default 'draft', "data" jsonb not null, "note" varchar(200) null, "published_at" timestamptz null, constraint "rate_book_version_pkey" primary key ("id"));`);
    this.addSql(`create index "rate_book_version_company_id_index" on "rate_book_version" ("company_id");`);
    this.addSql(`alter table "rate_book_version" add constraint "rate_book_version_company_id_number_unique" unique ("company_id", "number");`);

    this.addSql(`create table "lead" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "company_id" uuid not null, "reference" varchar(12) not null, "stage" varchar(24) not null default 'new', "source" varchar(12) not null default 'widget', "name" varchar(120) not null, "email" varchar(254) not null, "phone" varchar(20) not null, "address" varchar(200) not null, "postcode" varchar(12) not null, "preferred_contact" varchar(8) not null, "message" text null, "consent_at" timestamptz not null, "inputs" jsonb not null, "estimate" jsonb not null, "rate_book_version_id" uuid not null, "range_low_cents" int not null, "range_high_cents" int not null, "idempotency_key" varchar(64) not null, "draft_id" uuid null, "view_token_hash" varchar(64) not null, constraint "lead_pkey" primary key ("id"));`);
    this.addSql(`create index "lead_company_id_index" on "lead" ("company_id");`);
    this.addSql(`alter table "lead" add constraint "lead_reference_unique" unique ("reference");`);
    this.addSql(`create index "lead_company_id_created_at_index" on "lead" ("company_id", "created_at");`);
    this.addSql(`alter table "lead" add constraint "lead_company_id_idempotency_key_unique" unique ("company_id", "idempotency_key");`);

    this.addSql(`create table "lead_photo" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "company_id" uuid not null, "draft_id" uuid not null, "lead_id" uuid null, "status" varchar(12) not null default 'pending', "upload_key" varchar(200) not null, "image_key" varchar(200) null, "thumb_key" varchar(200) null, "width" int null, "height" int null, "bytes" int null, "original_name" varchar(120) not null, "refusal" varchar(300) null, constraint "lead_photo_pkey" primary key ("id"));`);
    this.addSql(`create index "lead_photo_company_id_index" on "lead_photo" ("company_id");`);
    this.addSql(`create index "lead_photo_lead_id_index" on "lead_photo" ("lead_id");`);
    this.addSql(`create index "lead_photo_company_id_draft_id_index" on "lead_photo" ("company_id", "draft_id");`);

    this.addSql(`alter table "funnel_event" add constraint "funnel_event_company_id_foreign" foreign key ("company_id") references "company" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "rate_book_version" add constraint "rate_book_version_company_id_foreign" foreign key ("company_id") references "company" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "lead" add constraint "lead_company_id_foreign" foreign key ("company_id") references "company" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "lead" add constraint "lead_rate_book_version_id_foreign" foreign key ("rate_book_version_id") references "rate_book_version" ("id") on update cascade on delete restrict;`);

    this.addSql(`alter table "lead_photo" add constraint "lead_photo_company_id_foreign" foreign key ("company_id") references "company" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "lead_photo" add constraint "lead_photo_lead_id_foreign" foreign key ("lead_id") references "lead" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "company" add column "embed_origins" jsonb not null default '[]', add column "notification_emails" jsonb not null default '[]', add column "service_postcodes" jsonb not null default '[]', add column "brand_color" varchar(7) not null default '#2F6B4F', add column "phone" varchar(20) null, add column "website" varchar(200) null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "lead" drop constraint "lead_rate_book_version_id_foreign";`);

    this.addSql(`alter table "lead_photo" drop constraint "lead_photo_lead_id_foreign";`);

    this.addSql(`drop table if exists "funnel_event" cascade;`);

    this.addSql(`drop table if exists "rate_book_version" cascade;`);

    this.addSql(`drop table if exists "lead" cascade;`);

    this.addSql(`drop table if exists "lead_photo" cascade;`);

    this.addSql(`alter table "company" drop column "embed_origins", drop column "notification_emails", drop column "service_postcodes", drop column "brand_color", drop column "phone", drop column "website";`);
  }

}
