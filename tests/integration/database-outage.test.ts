import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import pg from 'pg';
import { startAppServer, type AppServer } from '../helpers/app-server';
import { openPrivateCluster, type PrivateCluster } from '../helpers/private-cluster';

/**
 * The app against a database server that goes away and comes back. It runs the production build
 * as a child process on a cluster of its own, because what is under test is whether the process
 * survives, and the shared test cluster must stay up for the other files.
 */

/** Ends every connection to the database but this one: each gets the server's 57P01 notice. */
async function terminateOtherConnections(url: string): Promise<number> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    // Source: PostgreSQL 15 manual, 9.27.2 "Server Signaling Functions" (pg_terminate_backend) and
    // Appendix A (57P01 admin_shutdown is what the ended connections receive).
    const { rows } = await client.query<{ ended: number }>(
      `select count(*)::int as ended from (select pg_terminate_backend(pid) from pg_stat_activity
        where datname = current_database() and pid <> pg_backend_pid()) as t`,
    );
    // Wait until the ended backends are gone, so their notices have been sent.
    for (let attempt = 0; attempt < 100; attempt++) {
      const { rows: left } = await client.query<{ n: number }>(
        `select count(*)::int as n from pg_stat_activity where datname = current_database() and pid <> pg_backend_pid()`,
      );
      if (left[0].n === 0) break;
      await new Promise((resolve) => setTimeout(resolve, 50));
    }
    return rows[0].ended;
  } finally {
    await client.end();
  }
}

/** Asks until `check` passes (bounded); recovery from an outage takes real time that no fake clock can stand in for. */
async function eventually(server: AppServer, ask: () => Promise<Response>, check: (response: Response) => boolean, attempts = 100): Promise<Response> {
  let last: Response | Error | undefined;
  for (let attempt = 0; attempt < attempts; attempt++) {
    try {
      last = await ask();
      if (check(last)) return last;
    } catch (error) {
      last = error as Error;
    }
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
  throw new Error(
    `Gave up waiting; last answer: ${last instanceof Response ? last.status : last}; the app ${server.alive() ? 'runs' : 'has exited'}, its output:\n${server.output()}`,
  );
}

const postEstimate = (app: AppServer, slug: string) =>
  fetch(`${app.origin}/api/embed/${slug}/estimate`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{}' });
const health = (app: AppServer) => fetch(`${app.origin}/api/health`);

async function expectJson503(response: Response) {
  expect(response.status).toBe(503);
  expect(Number(response.headers.get('retry-after'))).toBeGreaterThan(0);
  expect(response.headers.get('content-type')).toMatch(/^application\/json/);
  const body = await response.json();
  expect(body).toEqual({ error: expect.any(String) });
}

describe('a database restart', () => {
  let cluster: PrivateCluster;
  let app: AppServer;
  let startedDuringOutage: AppServer | undefined;

  beforeAll(async () => {
    cluster = await openPrivateCluster(process.env);
    // At warn, so the outage warnings this test reads are written whatever the run's LOG_LEVEL.
    app = await startAppServer({ ...process.env, DATABASE_URL: cluster.url, LOG_LEVEL: 'warn' });
  }, 120_000);

  afterAll(async () => {
    await app?.stop();
    await startedDuringOutage?.stop();
    cluster?.remove();
  });

  test('the app survives it, answers 503 with Retry-After while the database is away, and recovers by itself', async () => {
    expect((await health(app)).status).toBe(200);
    // A bad body, but only after the firm lookup and the rate limits: every pool now holds connections.
    expect((await postEstimate(app, 'cedar-hollow')).status).toBe(400);

    expect(await terminateOtherConnections(cluster.url)).toBeGreaterThan(0);
    await eventually(
      app,
      () => health(app),
      (response) => response.status === 200,
    );
    expect((await postEstimate(app, 'cedar-hollow')).status).toBe(400);
    expect(app.alive(), app.output()).toBe(true);

    cluster.stop();
    await expectJson503(await health(app));
    // The answer and the server's warning about it carry the same request id.
    const traced = await fetch(`${app.origin}/api/health`, { headers: { 'X-Request-Id': 'outage-check-1' } });
    expect(traced.status).toBe(503);
    expect(traced.headers.get('x-request-id')).toBe('outage-check-1');
    const warning = await app.logLine((line) => line.requestId === 'outage-check-1' && line.level === 40);
    expect(warning.msg).toMatch(/unavailable/);
    await expectJson503(await postEstimate(app, 'northgate'));
    // A page gets a plain page that says so, never the widget's "not taking estimates" or an empty 500.
    const page = await fetch(`${app.origin}/embed/northgate`);
    expect(page.status).toBe(503);
    expect(Number(page.headers.get('retry-after'))).toBeGreaterThan(0);
    expect(page.headers.get('content-type')).toMatch(/^text\/html/);
    expect(await page.text()).toMatch(/try again/i);

    // A process that starts while the database is away comes up too once it returns.
    startedDuringOutage = await startAppServer({ ...process.env, DATABASE_URL: cluster.url });
    await expectJson503(await health(startedDuringOutage));

    cluster.start();
    for (const server of [app, startedDuringOutage]) {
      await eventually(
        server,
        () => health(server),
        (response) => response.status === 200,
      );
      expect((await postEstimate(server, 'cedar-hollow')).status).toBe(400);
      expect((await fetch(`${server.origin}/embed/northgate`)).status).toBe(200);
      expect(server.alive(), server.output()).toBe(true);
    }
  }, 120_000);
});
