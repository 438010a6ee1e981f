import { Migration } from '@mikro-orm/migrations';

export class Migration20261201221627_mail_outbox extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "mail_outbox" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "company_id" uuid null, "to_address" varchar(254) not null, "subject" varchar(300) not null, "text_body" text not null, "html_body" text null, "reply_to" varchar(254) null, "status" varchar(8) not null default 'queued', "attempts" int not null default 0, "next_attempt_at" timestamptz not null, "last_error" text null, "sent_at" timestamptz null, constraint "mail_outbox_pkey" primary key ("id"));`);
    this.addSql(`create index "mail_outbox_company_id_index" on "mail_outbox" ("company_id");`);
    this.addSql(`create index "mail_outbox_status_next_attempt_at_index" on "mail_outbox" ("status", "next_attempt_at");`);

    this.addSql(`alter table "mail_outbox" add constraint "mail_outbox_company_id_foreign" foreign key ("company_id") references "company" ("id") on update cascade on delete cascade;`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "mail_outbox" cascade;`);
  }

}
