// @ts-check
// Extra entries of the server build, built by Vite like the rest of the server code, so
// decorators, `import.meta.glob` and the `~/` alias work there too, and Rollup shares every module
// with the app's entry (one ORM per process):
//   background.ts → dist/server/background.mjs, the job runner; `scripts/serve.mjs` starts it.
//   config-check.ts → dist/server/config-check.mjs; `scripts/serve.mjs` checks the settings with it
//     before it loads anything else.
// Runs `background.ts` in the server process:
//   astro dev: loads background.ts through the dev server's module graph (the one pages use)
//     once the server listens, and stops it before the dev server closes. On SIGTERM, Vite closes
//     the dev server and exits; on SIGINT nothing would, so that is handled here.
import { fileURLToPath } from 'node:url';

const entry = fileURLToPath(new URL('./background.ts', import.meta.url));
const extraEntries = { background: entry, 'config-check': fileURLToPath(new URL('./config-check.ts', import.meta.url)) };

/**
 * @param {import('rollup').InputOption | undefined} input
 * @returns {import('rollup').InputOption}
 */
function withEntries(input) {
  const files = Object.values(extraEntries);
  if (!input) return files;
  if (typeof input === 'string') return [input, ...files];
  if (Array.isArray(input)) return [...input, ...files];
  return { ...input, ...extraEntries };
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
        vite.plugins = [
          ...(vite.plugins ?? []),
          { name: 'lapwing-background-entry', options: (options) => ({ ...options, input: withEntries(options.input) }) },
        ];
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
