// `npm run bench`: runs every bench/*.bench.ts (or those whose name contains the first argument).
// Each prints its figures and writes bench/results/<name>.json; a summary table follows.
// Benchmarks get the same throwaway environment as the tests (database, stand-ins, a production
// build), so those that need a running app can start `node scripts/serve.mjs` with `process.env`.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { ensureChromium, ensureNodeModules, log, root } from './lib/setup.mjs';
import { buildIfNeeded } from './lib/services.mjs';
import { openThrowawayEnvironment } from './lib/throwaway.mjs';

ensureNodeModules();
ensureChromium();
const benchDir = path.join(root, 'bench');
const resultsDir = path.join(benchDir, 'results');
mkdirSync(resultsDir, { recursive: true });
const only = process.argv[2];
const files = readdirSync(benchDir)
  .filter((f) => f.endsWith('.bench.ts') && (!only || f.includes(only)))
  .sort();

const { env, cleanUp } = await openThrowawayEnvironment({ database: 'lapwing_bench' });
let failedToRun = false;
try {
  buildIfNeeded(env);
  for (const file of files) {
    log(`bench ${file}`);
    const result = spawnSync(path.join(root, 'node_modules/.bin/tsx'), [path.join('bench', file)], { cwd: root, stdio: 'inherit', env });
    if (result.status !== 0) failedToRun = true;
  }
} finally {
  await cleanUp();
}
log('Summary (bench/results/*.json):');
for (const file of files) {
  const json = path.join(resultsDir, file.replace(/\.bench\.ts$/, '.json'));
  if (!existsSync(json)) continue;
  const { name, figures, target, passed } = JSON.parse(readFileSync(json, 'utf8'));
  console.log(
    `  ${passed ? 'meets target' : 'MISSES target'}  ${name}: ${JSON.stringify(figures)}  (target: ${typeof target === 'string' ? target : JSON.stringify(target)})`,
  );
}
process.exit(failedToRun ? 1 : 0);
