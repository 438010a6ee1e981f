/**
 * Builds the estimate worker (estimate-worker.ts and the core it imports, zod included) into one
 * plain ES module a worker thread can load: Vite bundles the app, but a worker is started from a
 * file on disk at run time. Three places use it:
 * - `astro build` writes dist/server/estimate-worker.mjs (the integration below);
 * - in development and tests, the pool builds it on first use into node_modules/.cache, under a
 *   name that is the hash of its content, so a changed core never runs a stale worker.
 */
import { createHash } from 'node:crypto';
import { existsSync } from 'node:fs';
import { mkdir, readdir, rename, rm, stat, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';

export const WORKER_FILE_NAME = 'estimate-worker.mjs';
const entry = fileURLToPath(new URL('./estimate-worker.ts', import.meta.url));

/** The worker bundle's code (esbuild, Node 20, ES module). */
export async function bundleEstimateWorker(): Promise<string> {
  const result = await build({
    entryPoints: [entry],
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    write: false,
    logLevel: 'silent',
    legalComments: 'none',
  });
  return result.outputFiles[0]!.text;
}

/** Writes the bundle to `file` (whole or not at all: several processes may build at once). */
export async function writeEstimateWorker(file: string, code?: string): Promise<string> {
  const text = code ?? (await bundleEstimateWorker());
  await mkdir(path.dirname(file), { recursive: true });
  const partial = `${file}.${process.pid}.${Date.now()}.tmp`;
  await writeFile(partial, text);
  await rename(partial, file);
  return file;
}

/** For development and tests: the worker built from the current sources, built now if needed. */
export async function freshEstimateWorker(): Promise<string> {
  const code = await bundleEstimateWorker();
  const hash = createHash('sha256').update(code).digest('hex').slice(0, 16);
  const dir = path.join(projectRoot(), 'node_modules', '.cache', 'lapwing');
  const file = path.join(dir, `estimate-worker-${hash}.mjs`);
  if (existsSync(file)) return file;
  await writeEstimateWorker(file, code);
  await removeOldWorkers(dir, file);
  return file;
}

/** Builds of older sources, left a day ago or more (a process started before then may still use one). */
async function removeOldWorkers(dir: string, keep: string): Promise<void> {
  const dayAgo = Date.now() - 24 * 3600_000;
  for (const name of await readdir(dir)) {
    const file = path.join(dir, name);
    if (file === keep || !/^estimate-worker-[0-9a-f]+\.mjs$/.test(name)) continue;
    const modified = (await stat(file).catch(() => null))?.mtimeMs ?? Infinity;
    if (modified < dayAgo) await rm(file, { force: true });
  }
}

function projectRoot(): string {
  let dir = path.dirname(entry);
  while (!existsSync(path.join(dir, 'package.json')) && path.dirname(dir) !== dir) dir = path.dirname(dir);
  return dir;
}

/** Astro integration: after `astro build`, writes the worker next to the server bundle. */
export function estimateWorker() {
  let serverDir: URL | undefined;
  return {
    name: 'lapwing-estimate-worker',
    hooks: {
      'astro:config:done': ({ config }: { config: { build: { server: URL } } }) => {
        serverDir = config.build.server;
      },
      'astro:build:done': async () => {
        if (serverDir) await writeEstimateWorker(fileURLToPath(new URL(WORKER_FILE_NAME, serverDir)));
      },
    },
  };
}
