import { MikroORM } from '@mikro-orm/postgresql';
import type { Constructor } from '@mikro-orm/core';
import type { Migration } from '@mikro-orm/migrations';
import { provideOrm } from '../db/orm-provider';

// Vite bundles the migrations into the server, because the migrator's own file loading uses a
// native import() of .ts files that only works under tsx (the CLI), not in the built app or vitest.
const migrationModules = import.meta.glob<Record<string, Constructor<Migration>>>('../../../../migrations/Migration*.ts', { eager: true });

export const migrationsList = Object.entries(migrationModules)
  .map(([file, module]) => {
    const name = file.split('/').pop()!.replace(/\.ts$/, '');
    return { name, class: module[name]! };
  })
  .sort((a, b) => a.name.localeCompare(b.name));

let ormPromise: Promise<MikroORM> | undefined;

/**
 * The process-wide ORM, initialised on first use. Requests use forks of its EntityManager.
 * A failed start (the database is down when the process starts) is forgotten, so the next request
 * tries again instead of the process failing for good.
 */
export function getOrm(): Promise<MikroORM> {
  ormPromise ??= (async () => {
    const { default: options } = await import('../../../../mikro-orm.config');
    const orm = await MikroORM.init({ ...options, connect: false, migrations: { ...options.migrations, migrationsList } });
    try {
      await orm.connect();
    } catch (error) {
      await orm.close(true).catch(() => undefined);
      throw error;
    }
    return orm;
  })().catch((error: unknown) => {
    ormPromise = undefined;
    throw error;
  });
  return ormPromise;
}

provideOrm(getOrm);

/** Opens a separate ORM on another database (tests use it for throwaway databases). */
export async function openOrm(clientUrl: string): Promise<MikroORM> {
  const { default: options } = await import('../../../../mikro-orm.config');
  return MikroORM.init({ ...options, clientUrl, migrations: { ...options.migrations, migrationsList } });
}
