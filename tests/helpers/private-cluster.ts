/**
 * A PostgreSQL cluster of one test file's own, on a free loopback port, for tests that stop and
 * start the database server itself (the shared cluster of `npm test` must keep running for the
 * other test files).
 */
import { chmodSync, mkdtempSync } from 'node:fs';
import path from 'node:path';
import { ensureDatabase, initCluster, removeClusterFolder, startCluster, stopCluster, databaseUrl } from '../../scripts/lib/postgres.mjs';
import { freePort, postgresBinDir } from '../../scripts/lib/setup.mjs';
import { runDbTasks } from '../../scripts/lib/services.mjs';

export type PrivateCluster = {
  /** URL of the migrated, demo-seeded database. */
  url: string;
  start: () => void;
  stop: () => void;
  remove: () => void;
};

/** Creates the cluster, starts it, and migrates and seeds one database (`env` supplies the other settings the seed needs). */
export async function openPrivateCluster(env: NodeJS.ProcessEnv, database = 'lapwing_private'): Promise<PrivateCluster> {
  const binDir = postgresBinDir();
  if (!binDir) throw new Error('PostgreSQL is not installed: run the tests with `npm test`.');
  const workDir = mkdtempSync('/tmp/lapwing-cluster-');
  chmodSync(workDir, 0o755);
  const cluster = initCluster({ binDir, dir: path.join(workDir, 'pg'), port: await freePort() });
  startCluster(cluster);
  ensureDatabase(cluster, database);
  const url: string = databaseUrl(cluster, database);
  runDbTasks({ ...env, DATABASE_URL: url }, ['migrate', 'seed-demo']);
  return {
    url,
    start: () => startCluster(cluster),
    stop: () => stopCluster(cluster),
    remove: () => {
      stopCluster(cluster);
      removeClusterFolder(workDir);
    },
  };
}
