import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { MikroORM } from '@mikro-orm/postgresql';
import { migrationsList, openOrm } from '../../src/lib/server/db/orm';
import { createThrowawayDatabase } from '../helpers/database';

async function tableNames(orm: MikroORM): Promise<string[]> {
  const rows = await orm.em
    .getConnection()
    .execute<{ table_name: string }[]>(`select table_name from information_schema.tables where table_schema = 'public' and table_name <> 'mikro_orm_migrations' order by table_name`);
  return rows.map((row) => row.table_name);
}

describe('migrations', () => {
  let orm: MikroORM;
  let drop: () => Promise<void>;

  beforeAll(async () => {
    const database = await createThrowawayDatabase();
    drop = database.drop;
    orm = await openOrm(database.url);
  });

  afterAll(async () => {
    await orm?.close(true);
    await drop?.();
  });

  test('every committed migration is bundled for the app', () => {
    expect(migrationsList.length).toBeGreaterThan(0);
    expect(migrationsList.map((m) => m.name)).toEqual([...migrationsList.map((m) => m.name)].sort());
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
});
