// The settings check of src/lib/server/config.ts for scripts/serve.mjs, which runs plain Node and
// cannot load TypeScript: after each build this compiles that one file (it imports only zod) to
// dist/server/config-check.mjs, with the esbuild that Vite ships.
import { readFile, writeFile } from 'node:fs/promises';
import { transformWithEsbuild } from 'vite';

const source = new URL('../../src/lib/server/config.ts', import.meta.url);

/** @returns {import('astro').AstroIntegration} */
export function configCheck() {
  /** @type {URL | undefined} */
  let serverDir;
  return {
    name: 'lapwing-config-check',
    hooks: {
      'astro:config:done': ({ config }) => {
        serverDir = config.build.server;
      },
      'astro:build:done': async () => {
        if (!serverDir) throw new Error('lapwing-config-check: the build has no server folder.');
        const { code } = await transformWithEsbuild(await readFile(source, 'utf8'), 'config.ts', { loader: 'ts', format: 'esm', target: 'node20' });
        await writeFile(new URL('config-check.mjs', serverDir), code);
      },
    },
  };
}
