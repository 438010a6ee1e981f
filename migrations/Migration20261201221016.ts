import { Migration } from '@mikro-orm/migrations';

export class Migration20261201221016 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "company" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "slug" varchar(60) not null, "name" varchar(120) not null, "time_zone" varchar(64) not null default 'America/New_York', "currency" varchar(3) not null default 'USD', "units" varchar(8) not null default 'imperial', "locale" varchar(16) not null default 'en-US', constraint "company_pkey" primary key ("id"));`);
    this.addSql(`alter table "company" add constraint "company_slug_unique" unique ("slug");`);

    this.addSql(`create table "app_user" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "email" varchar(254) not null, "name" varchar(120) not null, "password_hash" varchar(255) null, constraint "app_user_pkey" primary key ("id"));`);
    this.addSql(`alter table "app_user" add constraint "app_user_email_unique" unique ("email");`);

    this.addSql(`create table "membership" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "company_id" uuid not null, "user_id" uuid not null, "role" varchar(16) not null, constraint "membership_pkey" primary key ("id"));`);
    this.addSql(`create index "membership_company_id_index" on "membership" ("company_id");`);
    this.addSql(`create index "membership_user_id_index" on "membership" ("user_id");`);
    this.addSql(`alter table "membership" add constraint "membership_company_id_user_id_unique" unique ("company_id", "user_id");`);

    this.addSql(`alter table "membership" add constraint "membership_company_id_foreign" foreign key ("company_id") references "company" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "membership" add constraint "membership_user_id_foreign" foreign key ("user_id") references "app_user" ("id") on update cascade on delete cascade;`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "membership" cascade;`);
    this.addSql(`drop table if exists "app_user" cascade;`);
    this.addSql(`drop table if exists "company" cascade;`);
  }

}
