import { randomBytes } from 'node:crypto';
import pg from 'pg';

function adminUrl(): string {
  const url = process.env.TEST_DATABASE_ADMIN_URL;
  if (!url) throw new Error('TEST_DATABASE_ADMIN_URL is not set: run the tests with `npm test`.');
  return url;
}

async function asAdmin<T>(work: (client: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: adminUrl() });
  await client.connect();
  try {
    return await work(client);
  } finally {
    await client.end();
  }
}

/** Creates an empty database on the test cluster; returns its URL and a function that drops it. */
export async function createThrowawayDatabase(): Promise<{ url: string; drop: () => Promise<void> }> {
  const name = `lapwing_tmp_${randomBytes(6).toString('hex')}`;
  await asAdmin((client) => client.query(`create database "${name}"`));
  const url = new URL(adminUrl());
  url.pathname = `/${name}`;
  return {
    url: url.toString(),
    drop: () => asAdmin((client) => client.query(`drop database if exists "${name}" with (force)`)).then(() => undefined),
  };
}
