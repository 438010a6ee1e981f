// `npm start`: set up everything on a fresh machine, then serve the app with the demo data.
// `npm run dev` does the same with Astro's dev server (hot reload) instead of the build.
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { ensureNodeModules, ensurePostgres, fail, log, portInUse, root } from './lib/setup.mjs';
import { ensureDatabase, initCluster, startCluster, stopCluster } from './lib/postgres.mjs';
import { dataDir, devAppSecret, devClusterDir, devPorts } from './lib/dev-cluster.mjs';
import { appEnv, buildIfNeeded, runDbTasks, startChild, startStandIns, stopChildren } from './lib/services.mjs';
import { keepRunning } from './lib/supervisor.mjs';

const dev = process.argv.includes('--dev');
const host = process.env.HOST || '127.0.0.1';
const { app: appPort, pg: pgPort, s3: s3Port, smtp: smtpPort } = devPorts();

ensureNodeModules();
const binDir = ensurePostgres();

// The data lives in .data/ (git-ignored).
const pgDir = devClusterDir();
mkdirSync(dataDir, { recursive: true });

for (const [name, port] of [
  ['app', appPort],
  ['PostgreSQL', pgPort],
  ['S3 stand-in', s3Port],
  ['SMTP stand-in', smtpPort],
]) {
  if (await portInUse(port)) fail(`Port ${port} (${name}) is taken. Stop what uses it, or set PORT / LAPWING_PG_PORT / LAPWING_S3_PORT / LAPWING_SMTP_PORT.`);
}

const appSecret = devAppSecret();

const cluster = initCluster({ binDir, dir: pgDir, port: pgPort });
startCluster(cluster);
ensureDatabase(cluster, 'lapwing');

const mailDir = path.join(dataDir, 'mail');
const env = { ...appEnv({ cluster, database: 'lapwing', s3Port, smtpPort, appPort, appSecret, mailDir }), HOST: host };

async function waitForHealth(url, timeoutMs = 120_000) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    try {
      if ((await fetch(url)).ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  throw new Error(`The app did not answer ${url} within ${timeoutMs / 1000} s.`);
}

let shuttingDown = false;
/** @type {ReturnType<typeof keepRunning> | undefined} */
let appSupervisor;
async function shutdown(code) {
  if (shuttingDown) return;
  shuttingDown = true;
  log('Stopping…');
  appSupervisor?.stop();
  await stopChildren();
  stopCluster(cluster);
  log('Stopped. The data is kept in .data/ (delete that folder to start over).');
  process.exit(code);
}
process.on('SIGINT', () => shutdown(0));
process.on('SIGTERM', () => shutdown(0));

try {
  await startStandIns({ env, dir: dataDir, s3Port, smtpPort, onExit: (code) => shutdown(code || 1) });

  runDbTasks(env, ['migrate', 'seed-demo']);

  if (!dev) buildIfNeeded(env);
  const [command, args] = dev
    ? [path.join(root, 'node_modules', '.bin', 'astro'), ['dev', '--host', host, '--port', String(appPort)]]
    : [process.execPath, ['scripts/serve.mjs']];
  // A crash of the app once it has answered restarts it (with a growing pause, scripts/lib/supervisor.mjs),
  // leaving PostgreSQL and the stand-ins running; one that never got that far would only fail again.
  let answered = false;
  appSupervisor = keepRunning({
    start: () =>
      new Promise((resolve) => {
        startChild('app server', command, args, { env, restarts: true, onExit: (code) => (answered ? resolve(code) : shutdown(code || 1)) });
      }),
    onRestart: ({ delayMs }) => log(`Starting the app server again in ${delayMs / 1000} s…`),
  });
  await waitForHealth(`http://${host}:${appPort}/api/health`);
  answered = true;
} catch (error) {
  process.stderr.write(`${error instanceof Error ? error.message : error}\n`);
  await shutdown(1);
}

const origin = `http://${host}:${appPort}`;
log(`Lapwing is ready at ${origin}
    Landing page      ${origin}/
    Staff sign-in     ${origin}/login
    Demo firm page    ${origin}/demo/cedar-hollow
    Demo sign-ins (password lapwing-demo-2026):
      olive@cedar-hollow.test (owner), sam@cedar-hollow.test and rhea@cedar-hollow.test (sales)
      nora@northgate.test (owner of the second firm)
    PostgreSQL 127.0.0.1:${pgPort} · S3 stand-in 127.0.0.1:${s3Port} · SMTP stand-in 127.0.0.1:${smtpPort}
    E-mails the app sends are kept in .data/mail/ · Ctrl-C stops everything`);
