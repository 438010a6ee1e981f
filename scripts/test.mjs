// `npm test`: every test on a throwaway database and stand-ins, on free loopback ports.
//   npm test                      type check, lint (ESLint), format check (Prettier), vitest (unit + integration),
//                                 then Playwright on a production build
//   npm test -- --only vitest [vitest args]   or   npm test -- --only e2e [playwright args]
import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { ensureChromium, ensureNodeModules, log, root } from './lib/setup.mjs';
import { buildIfNeeded } from './lib/services.mjs';
import { openThrowawayEnvironment } from './lib/throwaway.mjs';

const argv = process.argv.slice(2);
const onlyIndex = argv.indexOf('--only');
const only = onlyIndex >= 0 ? argv[onlyIndex + 1] : null;
const passThrough = onlyIndex >= 0 ? argv.filter((_, i) => i !== onlyIndex && i !== onlyIndex + 1) : argv;
const runVitest = only === null || only === 'vitest';
const runE2e = only === null || only === 'e2e';

ensureNodeModules();
if (runE2e) ensureChromium();

let failed = false;
const started = Date.now();
const throwaway = await openThrowawayEnvironment({
  onStandInsExit: () => {
    failed = true;
  },
});
const { cleanUp } = throwaway;
// Server logs below warnings would drown the test report; a test may still ask for more.
const env = { LOG_LEVEL: 'warn', ...throwaway.env };
process.on('SIGINT', async () => {
  await cleanUp();
  process.exit(130);
});

function step(name, command, args) {
  log(`${name}…`);
  const result = spawnSync(command, args, { cwd: root, env, stdio: 'inherit' });
  if (result.status !== 0) {
    failed = true;
    log(`${name} FAILED (exit code ${result.status ?? result.signal}).`);
  }
}

try {
  const bin = (name) => path.join(root, 'node_modules', '.bin', name);
  if (only === null) {
    step('Type check (astro check)', bin('astro'), ['check']);
    // `npm run lint` is these two; separate steps, so a formatting failure is visible by name.
    step('Lint (eslint)', bin('eslint'), ['.']);
    step('Format check (prettier --check)', bin('prettier'), ['--check', '.']);
  }
  // Some integration tests run the production server itself (tests/helpers/app-server.ts).
  buildIfNeeded(env);
  if (runVitest) step('Unit and integration tests (vitest)', bin('vitest'), ['run', ...(only === 'vitest' ? passThrough : [])]);
  if (runE2e) {
    step('End-to-end tests (Playwright, Debian Chromium)', bin('playwright'), ['test', ...(only === 'e2e' ? passThrough : [])]);
  }
} catch (error) {
  failed = true;
  process.stderr.write(`${error instanceof Error ? error.stack : error}\n`);
} finally {
  await cleanUp();
}
log(`${failed ? 'Some tests FAILED' : 'All tests passed'} (${Math.round((Date.now() - started) / 1000)} s).`);
process.exit(failed ? 1 : 0);
