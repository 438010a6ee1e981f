import { Migration } from '@mikro-orm/migrations';
import { finishFacts, searchTextOf } from '../src/lib/server/leads/list-search';
import { responseDueAt } from '../src/lib/server/leads/response-due';

type LeadRow = {
  id: string;
  name: string;
  email: string;
  phone: string;
  reference: string;
  address: string;
  postcode: string;
  created_at: string | Date;
  response_due_at: string | Date | null;
  time_zone: string;
  rooms: { treatmentName: string; treatmentKind: string }[] | null;
  net_sq_ft: string | number | null;
  photo_count: string | number | null;
};

const BATCH = 500;

/**
 * The Inquiries list: what it shows and filters by is kept on the lead (search text, finishes,
 * covered area, photo count) so a page never reads the estimate JSON; keyset indexes per firm and
 * a trigram index for search; the firm's response target; each person's column choice. Existing
 * leads get their list facts and their first-contact due time, computed by the same code the app
 * uses when it stores a lead.
 */
export class Migration20261203161000_inquiry_list extends Migration {
  override async up(): Promise<void> {
    await this.execute(`create extension if not exists pg_trgm;`);
    await this.execute(`alter table "company" add column "response_target_minutes" smallint not null default 240;`);
    await this.execute(`alter table "lead"
      add column "search_text" text not null default '',
      add column "finish_label" varchar(200) not null default '',
      add column "finish_kinds" text[] not null default '{}',
      add column "covered_sq_ft" int not null default 0,
      add column "photo_count" smallint not null default 0;`);

    await this.execute(`create table "list_column_choice" (
      "id" uuid not null,
      "created_at" timestamptz not null default now(),
      "updated_at" timestamptz not null default now(),
      "company_id" uuid not null,
      "user_id" uuid not null,
      "columns" jsonb not null,
      constraint "list_column_choice_pkey" primary key ("id"));`);
    await this.execute(`create index "list_column_choice_company_id_index" on "list_column_choice" ("company_id");`);
    await this.execute(
      `alter table "list_column_choice" add constraint "list_column_choice_company_id_user_id_unique" unique ("company_id", "user_id");`,
    );
    await this.execute(
      `alter table "list_column_choice" add constraint "list_column_choice_company_id_foreign" foreign key ("company_id") references "company" ("id") on update cascade on delete cascade;`,
    );
    await this.execute(
      `alter table "list_column_choice" add constraint "list_column_choice_user_id_foreign" foreign key ("user_id") references "app_user" ("id") on update cascade on delete cascade;`,
    );

    // Backfill in batches (keyset on id), before the indexes so they are built once.
    let after = '00000000-0000-0000-0000-000000000000';
    for (;;) {
      const rows = (await this.execute(
        `select l."id", l."name", l."email", l."phone", l."reference", l."address", l."postcode", l."created_at", l."response_due_at", c."time_zone",
           l."estimate"->'data'->'takeoff'->'rooms' as "rooms",
           l."estimate"->'data'->'takeoff'->>'netSqFt' as "net_sq_ft",
           l."estimate"->'data'->'takeoff'->'facts'->>'photoCount' as "photo_count"
         from "lead" l join "company" c on c."id" = l."company_id"
         where l."id" > ? order by l."id" limit ${BATCH}`,
        [after],
      )) as LeadRow[];
      if (rows.length === 0) break;
      for (const row of rows) {
        const finish = finishFacts(Array.isArray(row.rooms) ? row.rooms : []);
        const due = row.response_due_at ?? responseDueAt(new Date(row.created_at), row.time_zone);
        await this.execute(
          `update "lead" set "search_text" = ?, "finish_label" = ?, "finish_kinds" = ?::text[], "covered_sq_ft" = ?, "photo_count" = ?, "response_due_at" = ? where "id" = ?`,
          [
            searchTextOf(row),
            finish.label,
            `{${finish.kinds.map((k) => `"${k}"`).join(',')}}`,
            Math.round(Number(row.net_sq_ft ?? 0)),
            Number(row.photo_count ?? 0),
            new Date(due),
            row.id,
          ],
        );
      }
      after = rows[rows.length - 1]!.id;
    }

    await this.execute(
      `create index "lead_list_received_index" on "lead" ("company_id", "created_at", "id") where "deleted_at" is null;`,
    );
    await this.execute(
      `create index "lead_list_waiting_index" on "lead" ("company_id", coalesce("last_contact_at", "created_at"), "id") where "deleted_at" is null;`,
    );
    await this.execute(
      `create index "lead_list_score_index" on "lead" ("company_id", "triage_score", "id") where "deleted_at" is null;`,
    );
    await this.execute(
      `create index "lead_search_text_trgm_index" on "lead" using gin ("search_text" gin_trgm_ops) where "deleted_at" is null;`,
    );
  }

  override async down(): Promise<void> {
    await this.execute(`drop table if exists "list_column_choice" cascade;`);
    await this.execute(`drop index if exists "lead_list_received_index";`);
    await this.execute(`drop index if exists "lead_list_waiting_index";`);
    await this.execute(`drop index if exists "lead_list_score_index";`);
    await this.execute(`drop index if exists "lead_search_text_trgm_index";`);
    await this.execute(`alter table "lead"
      drop column "search_text", drop column "finish_label", drop column "finish_kinds", drop column "covered_sq_ft", drop column "photo_count";`);
    await this.execute(`alter table "company" drop column "response_target_minutes";`);
    // The pg_trgm extension stays: other schemas may use it, and it holds no data.
  }
}
