import { Migration } from '@mikro-orm/migrations';

/**
 * Inquiries become a working tool: who has each one, when it was first opened and first and last
 * contacted, when a first contact is due, the next follow-up, why it is not going ahead, a soft
 * delete, its triage score, and one timeline of everything that happened to it. Existing leads
 * get their "received" entry.
 */
export class Migration20261203160000_inquiry_work extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "lead"
      add column "assignee_id" uuid null,
      add column "opened_at" timestamptz null,
      add column "first_contact_at" timestamptz null,
      add column "last_contact_at" timestamptz null,
      add column "next_follow_up_at" timestamptz null,
      add column "response_due_at" timestamptz null,
      add column "lost_reason" varchar(120) null,
      add column "deleted_at" timestamptz null,
      add column "triage_score" smallint not null default 0;`);
    this.addSql(
      `alter table "lead" add constraint "lead_assignee_id_foreign" foreign key ("assignee_id") references "membership" ("id") on update cascade on delete set null;`,
    );

    this.addSql(`create table "lead_event" (
      "id" uuid not null,
      "created_at" timestamptz not null default now(),
      "updated_at" timestamptz not null default now(),
      "company_id" uuid not null,
      "lead_id" uuid not null,
      "kind" varchar(24) not null,
      "actor_id" uuid null,
      "at" timestamptz not null,
      "data" jsonb not null,
      "undone_at" timestamptz null,
      "undone_by_id" uuid null,
      constraint "lead_event_pkey" primary key ("id"));`);
    this.addSql(`create index "lead_event_company_id_index" on "lead_event" ("company_id");`);
    this.addSql(`create index "lead_event_lead_id_at_index" on "lead_event" ("lead_id", "at");`);
    this.addSql(
      `alter table "lead_event" add constraint "lead_event_company_id_foreign" foreign key ("company_id") references "company" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "lead_event" add constraint "lead_event_lead_id_foreign" foreign key ("lead_id") references "lead" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "lead_event" add constraint "lead_event_actor_id_foreign" foreign key ("actor_id") references "app_user" ("id") on update cascade on delete set null;`,
    );
    this.addSql(
      `alter table "lead_event" add constraint "lead_event_undone_by_id_foreign" foreign key ("undone_by_id") references "app_user" ("id") on update cascade on delete set null;`,
    );

    this.addSql(`insert into "lead_event" ("id", "company_id", "lead_id", "kind", "at", "data")
      select gen_random_uuid(), "company_id", "id", 'received', "created_at", jsonb_build_object('source', "source") from "lead";`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "lead_event" cascade;`);
    this.addSql(`alter table "lead" drop constraint "lead_assignee_id_foreign";`);
    this.addSql(`alter table "lead"
      drop column "assignee_id", drop column "opened_at", drop column "first_contact_at", drop column "last_contact_at",
      drop column "next_follow_up_at", drop column "response_due_at", drop column "lost_reason", drop column "deleted_at", drop column "triage_score";`);
  }
}
