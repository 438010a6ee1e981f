// Starting and supervising the local services shared by `npm start` and `npm test`.
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { fail, log, root } from './setup.mjs';
import { databaseUrl } from './postgres.mjs';

export const S3_BUCKET = 'lapwing-photos';

/** The environment the app, the tests and the db tasks read (see src/lib/server/config.ts). */
export function appEnv({ cluster, database, s3Port, smtpPort, appPort, appSecret, mailDir }) {
  return {
    ...process.env,
    ASTRO_TELEMETRY_DISABLED: '1',
    AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: 'true',
    HOST: '127.0.0.1',
    PORT: String(appPort),
    PUBLIC_ORIGIN: `http://127.0.0.1:${appPort}`,
    DATABASE_URL: databaseUrl(cluster, database),
    APP_SECRET: appSecret,
    S3_ENDPOINT: `http://127.0.0.1:${s3Port}`,
    S3_REGION: 'us-east-1',
    S3_BUCKET,
    S3_ACCESS_KEY_ID: 'S3RVER',
    S3_SECRET_ACCESS_KEY: 'S3RVER',
    S3_FORCE_PATH_STYLE: 'true',
    SMTP_URL: `smtp://127.0.0.1:${smtpPort}`,
    DEV_MAIL_DIR: mailDir,
  };
}

const children = new Set();
let stopping = false;
// Last resort if we exit without stopChildren(): never leave a child holding its port.
process.on('exit', () => {
  for (const child of children) child.kill('SIGKILL');
});

/**
 * Starts a long-running child. If it dies while we are not stopping, `onExit` is told: the caller
 * stops everything, or (with `restarts`) starts it again.
 */
export function startChild(name, command, args, { env, readyLine, onExit, restarts = false }) {
  // Detached: a Ctrl-C in the terminal reaches only us, and we stop the children in order.
  const child = spawn(command, args, { cwd: root, env, stdio: ['ignore', 'pipe', 'pipe'], detached: true });
  children.add(child);
  const ready = new Promise((resolve, reject) => {
    let buffer = '';
    const watch = (chunk) => {
      process.stdout.write(chunk);
      buffer += chunk.toString();
      if (readyLine && buffer.includes(readyLine)) resolve();
    };
    child.stdout.on('data', watch);
    child.stderr.on('data', (chunk) => process.stderr.write(chunk));
    if (!readyLine) resolve();
    child.once('exit', (code, signal) => {
      children.delete(child);
      reject(new Error(`${name} exited before it was ready (code ${code}, signal ${signal})`));
      if (!stopping) {
        const next = restarts ? 'it will be started again' : 'stopping everything';
        process.stderr.write(`\x1b[31m[lapwing]\x1b[0m ${name} stopped unexpectedly (code ${code ?? signal}); ${next}.\n`);
        onExit?.(code ?? 1);
      }
    });
  });
  return { child, ready };
}

/** Stops every child we started (SIGTERM, then SIGKILL after a grace period). */
export async function stopChildren() {
  stopping = true;
  await Promise.all(
    [...children].map(
      (child) =>
        new Promise((resolve) => {
          const timer = setTimeout(() => child.kill('SIGKILL'), 5000);
          child.once('exit', () => {
            clearTimeout(timer);
            resolve();
          });
          child.kill('SIGTERM');
        }),
    ),
  );
}

/** Starts the S3 and SMTP stand-ins (data in `dir`) and resolves once both listen. */
export function startStandIns({ env, dir, s3Port, smtpPort, onExit }) {
  return startChild('stand-ins', process.execPath, ['scripts/stand-ins.mjs'], {
    env: { ...env, STANDIN_DIR: dir, S3_PORT: String(s3Port), SMTP_PORT: String(smtpPort), APP_ORIGIN: env.PUBLIC_ORIGIN },
    readyLine: 'stand-ins ready',
    onExit,
  }).ready;
}

export function runDbTasks(env, tasks) {
  const result = spawnSync(path.join(root, 'node_modules', '.bin', 'tsx'), ['scripts/db.ts', ...tasks], { cwd: root, env, stdio: 'inherit' });
  if (result.status !== 0) fail(`Database tasks (${tasks.join(', ')}) failed.`);
}

// Written from widget/ whenever Astro starts (vitest's config too), so its time says nothing about the build.
const GENERATED = new Set([path.join(root, 'public', 'widget.js')]);

function newestMtime(target) {
  if (!existsSync(target) || GENERATED.has(target)) return 0;
  const stat = statSync(target);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const entry of readdirSync(target)) newest = Math.max(newest, newestMtime(path.join(target, entry)));
  return newest;
}

/** Builds the production server when any of its inputs is newer than the last build. */
export function buildIfNeeded(env, { force = false } = {}) {
  const entry = path.join(root, 'dist', 'server', 'entry.mjs');
  const inputs = ['src', 'public', 'widget', 'migrations', 'astro.config.mjs', 'tailwind.config.mjs', 'package-lock.json'];
  const builtAt = existsSync(entry) ? statSync(entry).mtimeMs : 0;
  if (!force && builtAt > Math.max(...inputs.map((input) => newestMtime(path.join(root, input))))) return;
  log('Building the app (astro build)…');
  const result = spawnSync(path.join(root, 'node_modules', '.bin', 'astro'), ['build'], { cwd: root, env, stdio: 'inherit' });
  if (result.status !== 0) fail('The build failed.');
}
