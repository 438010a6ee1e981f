import { defineConfig } from '@mikro-orm/postgresql';
import { Migrator } from '@mikro-orm/migrations';
import { entities } from './src/lib/server/boot/entities';
import { config } from './src/lib/server/config';
import { logger } from './src/lib/server/log';

/**
 * The one ORM configuration, used by the app, the tests and the MikroORM CLI
 * (`npm run db -- orm migration:create --name add_leads`).
 */
export default defineConfig({
  clientUrl: config.databaseUrl,
  entities,
  extensions: [Migrator],
  // Entities declare their types explicitly; no reflection at run time.
  discovery: { requireEntitiesArray: true },
  migrations: {
    path: './migrations',
    pathTs: './migrations',
    emit: 'ts',
    // Diff against the real database, not a snapshot file, so parallel branches cannot drift.
    snapshot: false,
    transactional: true,
    allOrNothing: true,
  },
  pool: { min: 0, max: 10 },
  // knex's own notices (such as a pooled connection the server ended) go to the server log, not to the console.
  driverOptions: {
    log: {
      warn: (message: unknown) => logger.warn({ source: 'knex' }, String(message)),
      error: (message: unknown) => logger.error({ source: 'knex' }, String(message)),
      deprecate: (message: unknown) => logger.warn({ source: 'knex' }, String(message)),
      debug: (message: unknown) => logger.debug({ source: 'knex' }, String(message)),
    },
  },
});
