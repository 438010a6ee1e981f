// `npm run bench`: runs every bench/*.bench.ts (each prints its figures and writes
// bench/results/<name>.json), then prints one summary table.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { ensureNodeModules, log, root } from './lib/setup.mjs';

ensureNodeModules();
const benchDir = path.join(root, 'bench');
const resultsDir = path.join(benchDir, 'results');
mkdirSync(resultsDir, { recursive: true });
const only = process.argv[2];
const files = readdirSync(benchDir).filter((f) => f.endsWith('.bench.ts') && (!only || f.includes(only))).sort();
let failedToRun = false;
for (const file of files) {
  log(`bench ${file}`);
  const result = spawnSync(path.join(root, 'node_modules/.bin/tsx'), [path.join('bench', file)], {
    cwd: root,
    stdio: 'inherit',
    env: { ...process.env, ASTRO_TELEMETRY_DISABLED: '1', AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: 'true' },
  });
  if (result.status !== 0) failedToRun = true;
}
log('Summary (bench/results/*.json):');
for (const file of files) {
  const json = path.join(resultsDir, file.replace(/\.bench\.ts$/, '.json'));
  if (!existsSync(json)) continue;
  const { name, figures, target, passed } = JSON.parse(readFileSync(json, 'utf8'));
  console.log(`  ${passed ? 'meets target' : 'MISSES target'}  ${name}: ${JSON.stringify(figures)}  (target: ${target})`);
}
process.exit(failedToRun ? 1 : 0);
