// Builds widget/loader.ts into public/widget.js whenever Astro starts (build or dev), with the
// esbuild that Vite ships: minified, one self-contained classic script.
import { readFile, writeFile } from 'node:fs/promises';
import { transformWithEsbuild } from 'vite';

export async function buildLoader() {
  const source = await readFile(new URL('./loader.ts', import.meta.url), 'utf8');
  const { code } = await transformWithEsbuild(source, 'loader.ts', { loader: 'ts', minify: true, target: 'es2019', format: 'iife' });
  return code;
}

/** @returns {import('astro').AstroIntegration} */
export function widgetLoader() {
  return {
    name: 'lapwing-widget-loader',
    hooks: {
      'astro:config:setup': async () => {
        await writeFile(new URL('../public/widget.js', import.meta.url), await buildLoader());
      },
    },
  };
}
