// The development setup of `npm start` (data folder, ports, secret), so other commands find it too.
import { createHash, randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
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

/** Ports of the development services; each can be moved with its variable. */
export function devPorts() {
  return {
    app: Number(process.env.PORT || 4321),
    pg: Number(process.env.LAPWING_PG_PORT || 54329),
    s3: Number(process.env.LAPWING_S3_PORT || 4569),
    smtp: Number(process.env.LAPWING_SMTP_PORT || 2525),
  };
}

/** The development APP_SECRET, made once and kept in .data/app-secret (git-ignored). */
export function devAppSecret() {
  const file = path.join(dataDir, 'app-secret');
  mkdirSync(dataDir, { recursive: true });
  if (!existsSync(file)) writeFileSync(file, randomBytes(32).toString('base64url'), { mode: 0o600 });
  return readFileSync(file, 'utf8').trim();
}
