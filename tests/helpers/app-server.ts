/**
 * Runs the production build (`node scripts/serve.mjs`) as a child process, the way `npm start`
 * and a deployment run it, so a test can watch whether the process survives what it is put through.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { freeLoopbackPort } from './ports';

export type AppServer = {
  origin: string;
  process: ChildProcess;
  /** Everything the process wrote to stdout and stderr so far. */
  output: () => string;
  /** The first JSON log line that `match` accepts, waiting for it to arrive (lines can trail the answer they describe). */
  logLine: (match: (line: Record<string, unknown>) => boolean) => Promise<Record<string, unknown>>;
  /** True while the process runs. */
  alive: () => boolean;
  stop: () => Promise<void>;
};

export async function startAppServer(env: NodeJS.ProcessEnv): Promise<AppServer> {
  if (!existsSync(path.resolve('dist/server/entry.mjs'))) throw new Error('No build in dist/: run the tests with `npm test`, which builds first.');
  const port = await freeLoopbackPort();
  const origin = `http://127.0.0.1:${port}`;
  const child = spawn(process.execPath, ['scripts/serve.mjs'], {
    env: { ...env, HOST: '127.0.0.1', PORT: String(port), PUBLIC_ORIGIN: origin },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout!.on('data', (chunk) => (output += chunk));
  child.stderr!.on('data', (chunk) => (output += chunk));
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  await new Promise<void>((resolve, reject) => {
    const watch = () => {
      if (output.includes('listening on')) resolve();
    };
    child.stdout!.on('data', watch);
    child.once('exit', (code) => reject(new Error(`The app server exited before listening (code ${code}):\n${output}`)));
  });
  const findLine = (match: (line: Record<string, unknown>) => boolean) =>
    output
      .split('\n')
      .filter((line) => line.startsWith('{') && line.endsWith('}'))
      .map((line) => JSON.parse(line) as Record<string, unknown>)
      .find(match);
  return {
    origin,
    process: child,
    output: () => output,
    logLine: (match) =>
      new Promise((resolve, reject) => {
        const look = () => {
          const found = findLine(match);
          if (!found) return false;
          child.stdout!.off('data', look);
          resolve(found);
          return true;
        };
        if (look()) return;
        child.stdout!.on('data', look);
        child.once('exit', () => reject(new Error(`The app server exited before writing the log line:\n${output}`)));
      }),
    alive: () => child.exitCode === null && child.signalCode === null,
    stop: async () => {
      if (child.exitCode === null && child.signalCode === null) child.kill('SIGTERM');
      await exited;
    },
  };
}
