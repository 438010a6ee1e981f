import { Migration } from '@mikro-orm/migrations';

/**
 * Working an inquiry: the firm's e-mail templates (three to start with, for every firm, existing
 * and new) and further keys to the homeowner's private estimate link, one per e-mail sent from
 * the inquiry page, so the first link keeps working beside them.
 *
 * New firms get the starting templates from a trigger on `company`, so every way a firm is created
 * (setup, the demo data, tests) gets them without remembering to. The texts live in one function,
 * used for the existing firms here and by the trigger afterwards.
 */
export class Migration20261203163000_inquiry_notes_mail extends Migration {
  override async up(): Promise<void> {
    this.addSql(`create table "mail_template" (
      "id" uuid not null,
      "created_at" timestamptz not null default now(),
      "updated_at" timestamptz not null default now(),
      "company_id" uuid not null,
      "name" varchar(80) not null,
      "subject" varchar(200) not null,
      "body" text not null,
      "position" smallint not null default 0,
      constraint "mail_template_pkey" primary key ("id"));`);
    this.addSql(`create index "mail_template_company_id_index" on "mail_template" ("company_id");`);
    this.addSql(
      `alter table "mail_template" add constraint "mail_template_company_id_foreign" foreign key ("company_id") references "company" ("id") on update cascade on delete cascade;`,
    );

    this.addSql(`create table "lead_view_key" (
      "id" uuid not null,
      "created_at" timestamptz not null default now(),
      "updated_at" timestamptz not null default now(),
      "company_id" uuid not null,
      "lead_id" uuid not null,
      "key_hash" varchar(64) not null,
      constraint "lead_view_key_pkey" primary key ("id"));`);
    this.addSql(`create index "lead_view_key_company_id_index" on "lead_view_key" ("company_id");`);
    this.addSql(`create index "lead_view_key_lead_id_index" on "lead_view_key" ("lead_id");`);
    this.addSql(`alter table "lead_view_key" add constraint "lead_view_key_key_hash_unique" unique ("key_hash");`);
    this.addSql(
      `alter table "lead_view_key" add constraint "lead_view_key_company_id_foreign" foreign key ("company_id") references "company" ("id") on update cascade on delete cascade;`,
    );
    this.addSql(
      `alter table "lead_view_key" add constraint "lead_view_key_lead_id_foreign" foreign key ("lead_id") references "lead" ("id") on update cascade on delete cascade;`,
    );

    this.addSql(`create function "add_starting_mail_templates"(firm uuid) returns void language sql as $fn$
      insert into "mail_template" ("id", "company_id", "name", "subject", "body", "position") values
      (gen_random_uuid(), firm, 'First reply', 'Your wall estimate from {firm} ({reference})', $t$Hello {name},

Thank you for pricing your walls with us. Your estimate of {range}, with a drawing of each wall, is here:
{estimate_link}

The range comes from the sizes you gave us. Once we have seen the rooms we can give you a firm price. When would suit you for a visit to measure?

{sender}
{firm} · {firm_phone}$t$, 1),
      (gen_random_uuid(), firm, 'Book a visit', 'A visit to measure your rooms ({reference})', $t$Hello {name},

We would like to come and measure the rooms in your estimate:
{estimate_link}

Reply with a few days and times that suit you and we will confirm one. Someone at home should be able to show us each room and where the outlets and switches are.

{sender}
{firm} · {firm_phone}$t$, 2),
      (gen_random_uuid(), firm, 'Follow-up', 'Any questions about your estimate? ({reference})', $t$Hello {name},

We sent you an estimate for your walls a little while ago and wanted to ask whether anything in it is unclear. You can open it again here:
{estimate_link}

If your plans have changed, a short reply is all we need.

{sender}
{firm} · {firm_phone}$t$, 3);
    $fn$;`);
    this.addSql(`select "add_starting_mail_templates"("id") from "company";`);
    this.addSql(`create function "company_starting_mail_templates"() returns trigger language plpgsql as $fn$
      begin
        perform "add_starting_mail_templates"(new."id");
        return new;
      end;
    $fn$;`);
    this.addSql(
      `create trigger "company_starting_mail_templates" after insert on "company" for each row execute function "company_starting_mail_templates"();`,
    );
  }

  override async down(): Promise<void> {
    this.addSql(`drop trigger if exists "company_starting_mail_templates" on "company";`);
    this.addSql(`drop function if exists "company_starting_mail_templates"();`);
    this.addSql(`drop function if exists "add_starting_mail_templates"(uuid);`);
    this.addSql(`drop table if exists "lead_view_key" cascade;`);
    this.addSql(`drop table if exists "mail_template" cascade;`);
  }
}
