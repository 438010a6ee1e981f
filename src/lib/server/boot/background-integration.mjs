// @ts-check
// Runs `background.ts` (the job runner) in the server process, built and loaded by Vite like the
// rest of the server code, so decorators, `import.meta.glob` and the `~/` alias work there too.
//   astro build: adds background.ts as a second entry of the server build. Rollup shares every
//     module with the app's entry, so `dist/server/background.mjs` and `dist/server/entry.mjs`
//     loaded in one process use one ORM. `scripts/serve.mjs` imports and starts it.
//   astro dev: loads background.ts through the dev server's module graph (the one pages use)
//     once the server listens, and stops it before the dev server closes. On SIGTERM, Vite closes
//     the dev server and exits; on SIGINT nothing would, so that is handled here.
import { fileURLToPath } from 'node:url';

const entry = fileURLToPath(new URL('./background.ts', import.meta.url));

/**
 * @param {import('rollup').InputOption | undefined} input
 * @returns {import('rollup').InputOption}
 */
function withEntry(input) {
  if (!input) return [entry];
  if (typeof input === 'string') return [input, entry];
  if (Array.isArray(input)) return [...input, entry];
  return { ...input, background: entry };
}

/** @returns {import('astro').AstroIntegration} */
export function backgroundEntry() {
  /** @type {import('vite').ViteDevServer | undefined} */
  let devServer;
  /** @type {{ stop: () => Promise<void> } | undefined} */
  let running;

  const stop = async () => {
    const current = running;
    running = undefined;
    await current?.stop();
  };
  const stopAndExit = () => {
    stop().finally(() => process.exit(0));
  };

  return {
    name: 'lapwing-background',
    hooks: {
      'astro:build:setup': ({ vite, target }) => {
        if (target !== 'server') return;
        vite.plugins = [...(vite.plugins ?? []), { name: 'lapwing-background-entry', options: (options) => ({ ...options, input: withEntry(options.input) }) }];
      },
      'astro:server:setup': ({ server }) => {
        devServer = server;
        // Vite's own SIGTERM handler awaits close() and then exits: stop the jobs first.
        const close = server.close.bind(server);
        server.close = async () => {
          await stop();
          await close();
        };
      },
      'astro:server:start': async ({ logger }) => {
        if (!devServer) return;
        const background = await devServer.ssrLoadModule(entry);
        running = background.startBackground();
        process.once('SIGINT', stopAndExit);
        logger.info('background jobs starting with the dev server');
      },
      'astro:server:done': async () => {
        process.off('SIGINT', stopAndExit);
        await stop();
      },
    },
  };
}
