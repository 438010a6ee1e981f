import { Migration } from '@mikro-orm/migrations';

/**
 * Rate book versions become editable drafts and frozen published versions: a revision number that
 * every save of a draft checks and raises (so two owners never overwrite each other silently), who
 * made, last saved and published each version, at most one draft per firm, and a trigger that
 * refuses any change to a version's numbers once it has left the draft state.
 */
export class Migration20261204100000_rate_book_drafts extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "rate_book_version" add column "revision" int not null default 1;`);
    this.addSql(`alter table "rate_book_version" add column "based_on_number" int null;`);
    this.addSql(`alter table "rate_book_version" add column "created_by_id" uuid null;`);
    this.addSql(`alter table "rate_book_version" add column "updated_by_id" uuid null;`);
    this.addSql(`alter table "rate_book_version" add column "published_by_id" uuid null;`);
    this.addSql(`alter table "rate_book_version" add column "retired_at" timestamptz null;`);
    for (const column of ['created_by_id', 'updated_by_id', 'published_by_id']) {
      this.addSql(
        `alter table "rate_book_version" add constraint "rate_book_version_${column.replace('_id', '')}_id_foreign" foreign key ("${column}") references "app_user" ("id") on update cascade on delete set null;`,
      );
    }
    // Older data may hold more than one draft per firm; the newest stays a draft, the rest are retired.
    this.addSql(`update "rate_book_version" v set "status" = 'retired', "retired_at" = now()
      where v."status" = 'draft' and exists (select 1 from "rate_book_version" n
        where n."company_id" = v."company_id" and n."status" = 'draft' and n."number" > v."number");`);
    this.addSql(`create unique index "rate_book_version_one_draft" on "rate_book_version" ("company_id") where "status" = 'draft';`);
    this.addSql(`create or replace function "rate_book_version_frozen"() returns trigger language plpgsql as $$
begin
  if old."status" <> 'draft' and (new."data" is distinct from old."data" or new."number" <> old."number"
      or new."company_id" <> old."company_id" or new."revision" <> old."revision") then
    raise exception 'rate book version % of firm % is %, and its numbers never change', old."number", old."company_id", old."status"
      using errcode = '55000';
  end if;
  if old."status" = 'retired' and new."status" <> 'retired' then
    raise exception 'a retired rate book version cannot be published again; copy it into a draft' using errcode = '55000';
  end if;
  if old."status" = 'published' and new."status" = 'draft' then
    raise exception 'a published rate book version cannot become a draft again' using errcode = '55000';
  end if;
  return new;
end $$;`);
    this.addSql(
      `create trigger "rate_book_version_frozen" before update on "rate_book_version" for each row execute function "rate_book_version_frozen"();`,
    );
  }

  override async down(): Promise<void> {
    this.addSql(`drop trigger "rate_book_version_frozen" on "rate_book_version";`);
    this.addSql(`drop function "rate_book_version_frozen"();`);
    this.addSql(`drop index "rate_book_version_one_draft";`);
    for (const column of ['created_by_id', 'updated_by_id', 'published_by_id']) {
      this.addSql(`alter table "rate_book_version" drop constraint "rate_book_version_${column.replace('_id', '')}_id_foreign";`);
    }
    for (const column of ['revision', 'based_on_number', 'created_by_id', 'updated_by_id', 'published_by_id', 'retired_at']) {
      this.addSql(`alter table "rate_book_version" drop column "${column}";`);
    }
  }
}
