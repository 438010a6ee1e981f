// Where `npm start` keeps its database, so other commands can find it.
import { createHash } from 'node:crypto';
import path from 'node:path';
import { log, root } from './setup.mjs';
import { reachableByPostgres } from './postgres.mjs';

export const dataDir = path.join(root, '.data');

/** .data/pg, or a folder under /var/tmp when the postgres user cannot enter the project. */
export function devClusterDir({ quiet = false } = {}) {
  const preferred = path.join(dataDir, 'pg');
  if (reachableByPostgres(preferred)) return preferred;
  const fallback = path.join('/var/tmp', `lapwing-pg-${createHash('sha256').update(root).digest('hex').slice(0, 12)}`);
  if (!quiet) log(`The postgres user cannot enter ${root}; keeping the database in ${fallback}.`);
  return fallback;
}
