import { Migration } from '@mikro-orm/migrations';

/**
 * Groundwork for the firm's side:
 * - stored JSON (rate books, lead inputs, estimate snapshots) moves into `{schemaVersion, data}` envelopes;
 * - a lead remembers a digest of the request its idempotency key came with;
 * - the stages and sources get the product's own names;
 * - at most one published rate book per firm, enforced by the database;
 * - units, currency and locale leave `company` (the published rate book holds them and was always the one read).
 */
export class Migration20261202043000_groundwork extends Migration {
  override async up(): Promise<void> {
    this.addSql(`update "rate_book_version" set "data" = jsonb_build_object('schemaVersion', 1, 'data', "data") where not ("data" ? 'schemaVersion');`);
    this.addSql(`update "lead" set "inputs" = jsonb_build_object('schemaVersion', 1, 'data', "inputs") where not ("inputs" ? 'schemaVersion');`);
    this.addSql(`update "lead" set "estimate" = jsonb_build_object('schemaVersion', 1, 'data', "estimate") where not ("estimate" ? 'schemaVersion');`);

    this.addSql(`alter table "lead" add column "request_digest" varchar(64) null;`);
    this.addSql(`update "lead" set "stage" = case "stage" when 'called-back' then 'spoken-to' when 'won' then 'going-ahead' when 'not-proceeding' then 'not-going-ahead' else "stage" end;`);
    this.addSql(`update "lead" set "source" = 'staff' where "source" = 'desk';`);

    this.addSql(`create unique index "rate_book_version_one_published" on "rate_book_version" ("company_id") where "status" = 'published';`);

    this.addSql(`alter table "company" drop column "currency", drop column "units", drop column "locale";`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "company" add column "currency" varchar(3) not null default 'USD', add column "units" varchar(8) not null default 'imperial', add column "locale" varchar(16) not null default 'en-US';`);

    this.addSql(`drop index "rate_book_version_one_published";`);

    this.addSql(`update "lead" set "source" = 'desk' where "source" = 'staff';`);
    this.addSql(`update "lead" set "stage" = case "stage" when 'spoken-to' then 'called-back' when 'going-ahead' then 'won' when 'not-going-ahead' then 'not-proceeding' else "stage" end;`);
    this.addSql(`alter table "lead" drop column "request_digest";`);

    this.addSql(`update "lead" set "estimate" = "estimate" -> 'data' where "estimate" ? 'schemaVersion';`);
    this.addSql(`update "lead" set "inputs" = "inputs" -> 'data' where "inputs" ? 'schemaVersion';`);
    this.addSql(`update "rate_book_version" set "data" = "data" -> 'data' where "data" ? 'schemaVersion';`);
  }
}
