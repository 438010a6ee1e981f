/**
 * A small real HTTP server for trying one React island in a real browser without building the whole
 * app: it serves a page with the island bundled by esbuild and hands API paths to the app's own
 * endpoint handlers (real database, real storage). It listens on the app's public origin, so the S3
 * stand-in's CORS rule for that origin applies exactly as in production.
 */
import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import path from 'node:path';
import type { APIRoute } from 'astro';
import type { EntityManager } from '@mikro-orm/postgresql';
import { build } from 'esbuild';
import postcss from 'postcss';
import tailwindcss from 'tailwindcss';
import { readFile } from 'node:fs/promises';
import { callRoute } from './api-route';

export type HarnessRoute = { method: string; pattern: RegExp; handler: APIRoute; params: (match: RegExpMatchArray) => Record<string, string> };

export type Harness = { origin: string; close: () => Promise<void> };

/** Bundles `entrySource` (TSX, resolved from tests/helpers) for the browser. */
async function bundle(entrySource: string): Promise<string> {
  const result = await build({
    stdin: { contents: entrySource, resolveDir: path.resolve('tests/helpers'), loader: 'tsx', sourcefile: 'island-entry.tsx' },
    bundle: true,
    write: false,
    format: 'esm',
    platform: 'browser',
    jsx: 'automatic',
    define: { 'process.env.NODE_ENV': '"development"' },
    logLevel: 'silent',
  });
  return result.outputFiles[0].text;
}

/** The app's own stylesheet (Tailwind and the palette), compiled as the build compiles it. */
async function appStylesheet(): Promise<string> {
  const file = path.resolve('src/styles/global.css');
  const { default: tailwindConfig } = await import('../../tailwind.config.mjs');
  // The font imports are left out: the harness serves no font files, and its checks do not need them.
  const source = (await readFile(file, 'utf8')).replace(/^@import .*$/gm, '');
  const result = await postcss([tailwindcss(tailwindConfig)]).process(source, { from: file });
  return result.css;
}

async function readBody(request: IncomingMessage): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const chunk of request) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks);
}

export async function startIslandHarness({
  entrySource,
  routes,
  em,
  clientAddress,
}: {
  entrySource: string;
  routes: HarnessRoute[];
  em: () => EntityManager;
  clientAddress: string;
}): Promise<Harness> {
  const origin = process.env.PUBLIC_ORIGIN;
  if (!origin) throw new Error('PUBLIC_ORIGIN is not set: run the tests with `npm test`.');
  const [script, css] = await Promise.all([bundle(entrySource), appStylesheet()]);
  const page = `<!doctype html><html lang="en" style="--brand:#2F6B4F;--brand-text:#ffffff"><head><meta charset="utf-8"><title>Island</title><style>${css}</style></head><body><main id="root" class="p-4"></main><script type="module" src="/island.js"></script></body></html>`;

  const answer = async (request: IncomingMessage, response: ServerResponse) => {
    const url = new URL(request.url ?? '/', origin);
    if (request.method === 'GET' && url.pathname === '/') {
      response.writeHead(200, { 'content-type': 'text/html; charset=utf-8' }).end(page);
      return;
    }
    if (request.method === 'GET' && url.pathname === '/island.js') {
      response.writeHead(200, { 'content-type': 'text/javascript; charset=utf-8' }).end(script);
      return;
    }
    for (const route of routes) {
      const match = url.pathname.match(route.pattern);
      if (!match || route.method !== request.method) continue;
      const body = await readBody(request);
      const answer = await callRoute(route.handler, {
        method: route.method,
        path: url.pathname,
        params: route.params(match),
        em: em(),
        body: body.length ? body.toString('utf8') : undefined,
        headers: { 'content-type': String(request.headers['content-type'] ?? '') },
        clientAddress,
      });
      response.writeHead(answer.status, Object.fromEntries(answer.headers.entries())).end(Buffer.from(await answer.arrayBuffer()));
      return;
    }
    response.writeHead(404, { 'content-type': 'text/plain' }).end('not found');
  };
  // A failure inside the harness answers 500 with its stack, rather than leaving the browser waiting.
  const server: Server = createServer((request, response) => {
    answer(request, response).catch((error: unknown) => {
      if (!response.headersSent) response.writeHead(500, { 'content-type': 'text/plain' });
      response.end(error instanceof Error ? (error.stack ?? error.message) : String(error));
    });
  });
  const { hostname, port } = new URL(origin);
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(Number(port), hostname, resolve);
  });
  return { origin, close: () => new Promise((resolve) => server.close(() => resolve())) };
}
