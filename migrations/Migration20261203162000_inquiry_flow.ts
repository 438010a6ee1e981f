import { Migration } from '@mikro-orm/migrations';

/**
 * The inquiry's workflow: each firm's own list of reasons an inquiry is not going ahead (one row
 * per firm, once the owner saves it), and the reminder e-mails owed when follow-ups come due.
 */
export class Migration20261203162000_inquiry_flow extends Migration {
  override async up(): Promise<void> {
    this.addSql(`create table "lost_reason_list" (
      "id" uuid not null,
      "created_at" timestamptz not null default now(),
      "updated_at" timestamptz not null default now(),
      "company_id" uuid not null,
      "reasons" jsonb not null,
      constraint "lost_reason_list_pkey" primary key ("id"));`);
    this.addSql(`create index "lost_reason_list_company_id_index" on "lost_reason_list" ("company_id");`);
    this.addSql(`alter table "lost_reason_list" add constraint "lost_reason_list_company_id_unique" unique ("company_id");`);
    this.addSql(
      `alter table "lost_reason_list" add constraint "lost_reason_list_company_id_foreign" foreign key ("company_id") references "company" ("id") on update cascade on delete cascade;`,
    );

    this.addSql(`create table "follow_up_reminder" (
      "id" uuid not null,
      "created_at" timestamptz not null default now(),
      "updated_at" timestamptz not null default now(),
      "company_id" uuid not null,
      "lead_id" uuid not null,
      "due_at" timestamptz not null,
      "set_by_id" uuid null,
      "sent_at" timestamptz null,
      constraint "follow_up_reminder_pkey" primary key ("id"));`);
    this.addSql(`create index "follow_up_reminder_company_id_index" on "follow_up_reminder" ("company_id");`);
    this.addSql(`create index "follow_up_reminder_lead_id_index" on "follow_up_reminder" ("lead_id");`);
    this.addSql(`create index "follow_up_reminder_due_at_index" on "follow_up_reminder" ("due_at");`);
    this.addSql(
      `alter table "follow_up_reminder" add constraint "follow_up_reminder_company_id_foreign" foreign key ("company_id") references "company" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "follow_up_reminder" add constraint "follow_up_reminder_lead_id_foreign" foreign key ("lead_id") references "lead" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "follow_up_reminder" add constraint "follow_up_reminder_set_by_id_foreign" foreign key ("set_by_id") references "app_user" ("id") on update cascade on delete set null;`,
    );
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "follow_up_reminder" cascade;`);
    this.addSql(`drop table if exists "lost_reason_list" cascade;`);
  }
}
