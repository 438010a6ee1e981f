import type { MikroORM } from '@mikro-orm/postgresql';
import { openOrm } from '../../src/lib/server/boot/orm';
import { createThrowawayDatabase } from './database';

/**
 * A database of this test file's own, with every migration applied and no demo data, for tests
 * whose work sweeps a whole table (the mail outbox, abandoned photos, the job runner) and so must
 * not meet rows of tests running in parallel.
 */
export async function openMigratedDatabase(): Promise<{ orm: MikroORM; url: string; close: () => Promise<void> }> {
  const database = await createThrowawayDatabase();
  const orm = await openOrm(database.url);
  await orm.migrator.up();
  return {
    orm,
    url: database.url,
    close: async () => {
      await orm.close(true);
      await database.drop();
    },
  };
}
