import { Migration } from '@mikro-orm/migrations';

export class Migration20261201221817_accounts extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "rate_limit" ("key" varchar(255) not null, "points" int not null default 0, "expire" bigint null, constraint "rate_limit_pkey" primary key ("key"));`);

    this.addSql(`create table "user_session" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "token_digest" varchar(64) not null, "user_id" uuid not null, "company_id" uuid null, "expires_at" timestamptz not null, "absolute_expires_at" timestamptz not null, constraint "user_session_pkey" primary key ("id"));`);
    this.addSql(`alter table "user_session" add constraint "user_session_token_digest_unique" unique ("token_digest");`);
    this.addSql(`create index "user_session_user_id_index" on "user_session" ("user_id");`);

    this.addSql(`create table "password_reset" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "user_id" uuid not null, "token_digest" varchar(64) not null, "expires_at" timestamptz not null, "used_at" timestamptz null, constraint "password_reset_pkey" primary key ("id"));`);
    this.addSql(`create index "password_reset_user_id_index" on "password_reset" ("user_id");`);
    this.addSql(`alter table "password_reset" add constraint "password_reset_token_digest_unique" unique ("token_digest");`);

    this.addSql(`create table "team_invite" ("id" uuid not null, "created_at" timestamptz not null default now(), "updated_at" timestamptz not null default now(), "company_id" uuid not null, "email" varchar(254) not null, "role" varchar(16) not null, "token_digest" varchar(64) not null, "invited_by_id" uuid null, "expires_at" timestamptz not null, "accepted_at" timestamptz null, constraint "team_invite_pkey" primary key ("id"));`);
    this.addSql(`create index "team_invite_company_id_index" on "team_invite" ("company_id");`);
    this.addSql(`alter table "team_invite" add constraint "team_invite_token_digest_unique" unique ("token_digest");`);

    this.addSql(`alter table "user_session" add constraint "user_session_user_id_foreign" foreign key ("user_id") references "app_user" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "user_session" add constraint "user_session_company_id_foreign" foreign key ("company_id") references "company" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "password_reset" add constraint "password_reset_user_id_foreign" foreign key ("user_id") references "app_user" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "team_invite" add constraint "team_invite_company_id_foreign" foreign key ("company_id") references "company" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "team_invite" add constraint "team_invite_invited_by_id_foreign" foreign key ("invited_by_id") references "app_user" ("id") on update cascade on delete set null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "team_invite" cascade;`);
    this.addSql(`drop table if exists "password_reset" cascade;`);
    this.addSql(`drop table if exists "user_session" cascade;`);
    this.addSql(`drop table if exists "rate_limit" cascade;`);
  }

}
