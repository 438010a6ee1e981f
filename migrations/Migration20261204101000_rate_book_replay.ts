import { Migration } from '@mikro-orm/migrations';

/** Replays of recent inquiries under a Rate book draft: progress while the job runs, then the summary. */
export class Migration20261204101000_rate_book_replay extends Migration {
  override async up(): Promise<void> {
    this.addSql(`create table "rate_book_replay" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "company_id" uuid not null, "draft_id" uuid not null, "draft_revision" int not null, "status" varchar(10) not null default 'queued', "total" int not null, "done" int not null default 0, "summary" jsonb null, "failure" varchar(300) null, constraint "rate_book_replay_pkey" primary key ("id"));`);
    this.addSql(`create index "rate_book_replay_company_id_index" on "rate_book_replay" ("company_id");`);
    this.addSql(`create index "rate_book_replay_draft_id_index" on "rate_book_replay" ("draft_id");`);
    this.addSql(`alter table "rate_book_replay" add constraint "rate_book_replay_company_id_foreign" foreign key ("company_id") references "company" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "rate_book_replay" add constraint "rate_book_replay_draft_id_foreign" foreign key ("draft_id") references "rate_book_version" ("id") on update cascade on delete cascade;`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "rate_book_replay" cascade;`);
  }
}
