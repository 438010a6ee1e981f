// `npm run db -- <command>`: database chores against the development database of `npm start`.
//   npm run db -- orm migration:create --name add_leads   (any MikroORM CLI command)
//   npm run db -- migrate | seed-demo                     (the tasks of scripts/db.ts)
//   npm run db -- reset                                   (drop and recreate the dev database)
// Uses the running cluster when `npm start` is up; otherwise starts it for the command.
import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { ensureNodeModules, ensurePostgres, fail, portInUse, root } from './lib/setup.mjs';
import { clusterIsRunning, ensureDatabase, initCluster, startCluster, stopCluster } from './lib/postgres.mjs';
import { appEnv, startStandIns, stopChildren } from './lib/services.mjs';
import { dataDir, devAppSecret, devClusterDir, devPorts } from './lib/dev-cluster.mjs';

const [command, ...rest] = process.argv.slice(2);
if (!command) fail('Usage: npm run db -- orm <mikro-orm command> | migrate | seed-demo | reset');

ensureNodeModules();
const binDir = ensurePostgres();
const ports = devPorts();
const cluster = initCluster({ binDir, dir: devClusterDir(), port: ports.pg });
const wasRunning = clusterIsRunning(cluster);
if (!wasRunning) startCluster(cluster);
const env = appEnv({
  cluster,
  database: 'lapwing',
  s3Port: ports.s3,
  smtpPort: ports.smtp,
  appPort: ports.app,
  appSecret: devAppSecret(),
  mailDir: path.join(dataDir, 'mail'),
});

// Seeding stores demo photos, so it needs the S3 stand-in; start the stand-ins unless `npm start` runs them.
if (['reset', 'seed-demo'].includes(command) && !(await portInUse(ports.s3))) {
  await startStandIns({ env, dir: dataDir, s3Port: ports.s3, smtpPort: ports.smtp });
}

let status = 0;
try {
  if (command === 'reset') {
    const connect = ['-h', '127.0.0.1', '-p', String(cluster.port), '-U', cluster.user];
    const pgEnv = { ...process.env, PGPASSWORD: cluster.password };
    spawnSync(path.join(binDir, 'dropdb'), [...connect, '--if-exists', '--force', 'lapwing'], { env: pgEnv, stdio: 'inherit' });
    ensureDatabase(cluster, 'lapwing');
    status = spawnSync(path.join(root, 'node_modules/.bin/tsx'), ['scripts/db.ts', 'migrate', 'seed-demo'], { cwd: root, env, stdio: 'inherit' }).status ?? 1;
  } else {
    ensureDatabase(cluster, 'lapwing');
    const argv = command === 'orm' ? ['./node_modules/@mikro-orm/cli/cli', ...rest] : ['scripts/db.ts', command, ...rest];
    status = spawnSync(path.join(root, 'node_modules/.bin/tsx'), argv, { cwd: root, env, stdio: 'inherit' }).status ?? 1;
  }
} finally {
  await stopChildren();
  if (!wasRunning) stopCluster(cluster);
}
process.exit(status);
