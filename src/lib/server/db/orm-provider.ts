import type { MikroORM } from '@mikro-orm/postgresql';

/**
 * The process's ORM, as lower layers reach it. The ORM itself is built in `boot/orm.ts`, which knows
 * every entity and therefore sits above every domain; code below it (the session store) asks here,
 * so no domain imports the list of all entities. `boot/orm.ts` registers itself when it is loaded.
 */
let provider: (() => Promise<MikroORM>) | undefined;

export function provideOrm(open: () => Promise<MikroORM>): void {
  provider = open;
}

export function currentOrm(): Promise<MikroORM> {
  if (!provider) throw new Error('The ORM has not been set up: import ~/lib/server/boot/orm first.');
  return provider();
}
