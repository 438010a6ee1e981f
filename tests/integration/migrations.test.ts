import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { MikroORM } from '@mikro-orm/postgresql';
import { migrationsList, openOrm } from '../../src/lib/server/boot/orm';
import { readdirSync } from 'node:fs';
import { createThrowawayDatabase } from '../helpers/database';
import { buildLead } from '../helpers/factories';
import { Company } from '../../src/lib/server/companies/company.entity';
import { estimateSnapshot } from '../../src/lib/server/estimates/estimate-snapshot';
import { Lead } from '../../src/lib/server/leads/lead.entity';
import { backgroundJobs } from '../../src/lib/server/boot/jobs';
import { JOBS_SCHEMA, startJobRunner } from '../../src/lib/server/jobs/runner';

async function tableNames(orm: MikroORM): Promise<string[]> {
  const rows = await orm.em
    .getConnection()
    .execute<{ table_name: string }[]>(
      `select table_name from information_schema.tables where table_schema = 'public' and table_name <> 'mikro_orm_migrations' order by table_name`,
    );
  return rows.map((row) => row.table_name);
}

describe('migrations', () => {
  let orm: MikroORM;
  let url: string;
  let drop: () => Promise<void>;

  beforeAll(async () => {
    const database = await createThrowawayDatabase();
    drop = database.drop;
    url = database.url;
    orm = await openOrm(database.url);
  });

  afterAll(async () => {
    await orm?.close(true);
    await drop?.();
  });

  test('every committed migration is bundled for the app, and applying them applies exactly those files', async () => {
    const files = readdirSync(new URL('../../migrations/', import.meta.url))
      .filter((f) => /^Migration.*\.ts$/.test(f))
      .map((f) => f.replace(/\.ts$/, ''))
      .sort();
    expect(migrationsList.map((m) => m.name)).toEqual(files);
    await orm.migrator.up();
    expect((await orm.migrator.getExecutedMigrations()).map((m) => m.name)).toEqual(files);
    await orm.migrator.down({ to: 0 });
  });

  test('apply all, undo all, apply all again, and the schema then matches the entities exactly', async () => {
    const migrator = orm.migrator;
    await migrator.up();
    const created = await tableNames(orm);
    expect(created).toEqual(expect.arrayContaining(['app_user', 'company', 'membership']));

    await migrator.down({ to: 0 });
    expect(await tableNames(orm)).toEqual([]);

    await migrator.up();
    expect(await tableNames(orm)).toEqual(created);

    // No drift: the migrations produce exactly what the entity definitions describe.
    const drift = await orm.schema.getUpdateSchemaSQL({ wrap: false });
    expect(drift.trim()).toBe('');
  });

  test('the job runner’s own schema (pg-boss) is invisible to the migrations and to the drift check', async () => {
    await orm.migrator.up();
    const runner = await startJobRunner({ orm, connectionString: url, jobs: backgroundJobs });
    await runner.stop();
    const [installed] = await orm.em
      .getConnection()
      .execute<{ n: number }[]>(`select count(*)::int as n from information_schema.tables where table_schema = ?`, [JOBS_SCHEMA]);
    expect(installed!.n).toBeGreaterThan(0);

    expect((await orm.schema.getUpdateSchemaSQL({ wrap: false })).trim()).toBe('');
    await orm.migrator.down({ to: 0 });
    expect(await tableNames(orm)).toEqual([]);
    await orm.migrator.up();
    expect((await orm.schema.getUpdateSchemaSQL({ wrap: false })).trim()).toBe('');
  });

  test('a lead stored before envelopes (bare JSON, old stage name) still opens after the migrations', async () => {
    const before = migrationsList[migrationsList.findIndex((m) => m.name.endsWith('_groundwork')) - 1]!.name;
    await orm.migrator.down({ to: 0 });
    await orm.migrator.up({ to: before });
    const em = orm.em.fork();
    const [company] = await em
      .getConnection()
      .execute<{ id: string }[]>(`insert into company (id, slug, name) values (gen_random_uuid(), 'old-firm', 'Old Firm') returning id`);
    // A lead as the earlier schema stored it: bare JSON in inputs, estimate and the rate book.
    const modern = buildLead(orm.em.fork(), company!.id);
    const bare = estimateSnapshot.read(modern.estimate);
    const [version] = await em
      .getConnection()
      .execute<{ id: string }[]>(
        `insert into rate_book_version (id, company_id, number, status, data) values (gen_random_uuid(), ?, 1, 'published', ?::jsonb) returning id`,
        [company!.id, JSON.stringify(modern.rateBookVersion.data.data)],
      );
    await em.getConnection().execute(
      `insert into lead (id, company_id, reference, stage, name, email, phone, address, postcode, preferred_contact, consent_at, inputs, estimate, rate_book_version_id, range_low_cents, range_high_cents, idempotency_key, view_token_hash)
       values (gen_random_uuid(), ?, 'OLD1-LEAD', 'called-back', 'Old Lead', 'old@example.test', '+15125550147', '1 Old Rd', '78704', 'email', now(), ?::jsonb, ?::jsonb, ?, 1, 2, 'old-key', repeat('0', 64))`,
      [company!.id, JSON.stringify(modern.inputs.data), JSON.stringify(bare), version!.id],
    );
    await orm.migrator.up();
    const lead = await orm.em.fork().findOneOrFail(Lead, { reference: 'OLD1-LEAD' }, { populate: ['estimate'] });
    expect(lead.stage).toBe('spoken-to');
    expect(estimateSnapshot.read(lead.estimate)).toEqual(bare);
    expect(await orm.em.fork().count(Company, { slug: 'old-firm' })).toBe(1);
  });
});
