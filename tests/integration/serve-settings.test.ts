import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { expect, test } from 'vitest';
import { freeLoopbackPort } from '../helpers/ports';

test('the production server refuses to start without PUBLIC_ORIGIN, naming it, before it listens', async () => {
  expect(existsSync('dist/server/entry.mjs'), 'run the tests with `npm test`, which builds first').toBe(true);
  const port = await freeLoopbackPort();
  const started = spawnSync(process.execPath, ['scripts/serve.mjs'], {
    env: { ...process.env, NODE_ENV: 'production', PUBLIC_ORIGIN: '', APP_SECRET: 'short', PORT: String(port) },
    encoding: 'utf8',
    // A server that does start never exits by itself; this bounds the wait, it is not a measurement.
    timeout: 15_000,
  });
  expect(started.stdout).not.toContain('listening');
  expect(started.status).toBe(1);
  expect(started.stderr).toContain('PUBLIC_ORIGIN must be set when NODE_ENV=production');
  expect(started.stderr).toContain('APP_SECRET must be at least 32 characters');
});
