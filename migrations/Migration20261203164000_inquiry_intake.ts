import { Migration } from '@mikro-orm/migrations';

/**
 * How inquiries come in and are kept tidy: each member chooses whether new-inquiry e-mails reach
 * them (on for everyone to begin with), an inquiry remembers the open one it looks like and the one
 * it was merged into, e-mail and phone are indexed per firm for that match, and the morning digest
 * records whom it reached on which day so a second run sends nothing twice.
 */
export class Migration20261203164000_inquiry_intake extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "membership" add column "new_inquiry_mail" boolean not null default true;`);

    this.addSql(`alter table "lead" add column "duplicate_of_id" uuid null, add column "merged_into_id" uuid null;`);
    this.addSql(
      `alter table "lead" add constraint "lead_duplicate_of_id_foreign" foreign key ("duplicate_of_id") references "lead" ("id") on update cascade on delete set null;`,
    );
    this.addSql(
      `alter table "lead" add constraint "lead_merged_into_id_foreign" foreign key ("merged_into_id") references "lead" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(`create index "lead_company_id_email_index" on "lead" ("company_id", "email");`);
    this.addSql(`create index "lead_company_id_phone_index" on "lead" ("company_id", "phone");`);

    this.addSql(`create table "inquiry_digest" (
      "id" uuid not null,
      "created_at" timestamptz not null default now(),
      "updated_at" timestamptz not null default now(),
      "company_id" uuid not null,
      "membership_id" uuid not null,
      "day" varchar(10) not null,
      constraint "inquiry_digest_pkey" primary key ("id"));`);
    this.addSql(`create index "inquiry_digest_company_id_index" on "inquiry_digest" ("company_id");`);
    this.addSql(`alter table "inquiry_digest" add constraint "inquiry_digest_membership_id_day_unique" unique ("membership_id", "day");`);
    this.addSql(
      `alter table "inquiry_digest" add constraint "inquiry_digest_company_id_foreign" foreign key ("company_id") references "company" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "inquiry_digest" add constraint "inquiry_digest_membership_id_foreign" foreign key ("membership_id") references "membership" ("id") on update cascade on delete cascade;`,
    );
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "inquiry_digest" cascade;`);
    this.addSql(`drop index "lead_company_id_email_index";`);
    this.addSql(`drop index "lead_company_id_phone_index";`);
    this.addSql(`alter table "lead" drop constraint "lead_duplicate_of_id_foreign";`);
    this.addSql(`alter table "lead" drop constraint "lead_merged_into_id_foreign";`);
    this.addSql(`alter table "lead" drop column "duplicate_of_id", drop column "merged_into_id";`);
    this.addSql(`alter table "membership" drop column "new_inquiry_mail";`);
  }
}
