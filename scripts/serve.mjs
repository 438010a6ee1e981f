// Serves the production build (`dist/`). It is Astro's own standalone handler behind a plain
// node:http server, for one reason: Astro 5's Node adapter takes the client address from
// X-Forwarded-For without any check, so anyone could pick a fresh address per request and walk
// past every per-address rate limit. Here the header is removed unless TRUST_PROXY=true (set it only
// behind a proxy that overwrites the header), so the address is the direct peer.
//
// The same process runs the background jobs (mail delivery, clean-ups): `dist/server/background.mjs`
// is a second entry of the same Vite build, sharing the app's modules (see DEVELOPERS.md,
// "Background jobs"). On SIGTERM/SIGINT it stops taking requests and jobs, gives running jobs a
// few seconds, and exits.
//
// Environment: HOST (default 127.0.0.1), PORT (default 4321), TRUST_PROXY.
import http from 'node:http';

process.env.ASTRO_NODE_AUTOSTART = 'disabled';
const { handler } = await import('../dist/server/entry.mjs');
const { startBackground } = await import('../dist/server/background.mjs');

const host = process.env.HOST || '127.0.0.1';
const port = Number(process.env.PORT || 4321);
const trustProxy = process.env.TRUST_PROXY === 'true';

// Built files (dist/client, /widget.js) are answered by the adapter before Astro's middleware runs,
// so they get their headers here: nothing in them may load anything when opened on their own, and
// none may be framed. Rendered pages and API answers replace these with their own (src/middleware.ts,
// src/lib/server/security-headers.ts), since headers a response writes win over ones set before.
const fileHeaders = [
  ['X-Content-Type-Options', 'nosniff'],
  ['Content-Security-Policy', "default-src 'none'; frame-ancestors 'none'"],
  ...((process.env.PUBLIC_ORIGIN ?? '').startsWith('https://') ? [['Strict-Transport-Security', 'max-age=31536000; includeSubDomains']] : []),
];

const server = http.createServer((req, res) => {
  if (!trustProxy) delete req.headers['x-forwarded-for'];
  for (const [name, value] of fileHeaders) res.setHeader(name, value);
  handler(req, res);
});
server.listen(port, host, () => {
  console.log(`Lapwing app server listening on http://${host}:${port}${trustProxy ? ' (trusting X-Forwarded-For)' : ''}`);
});
const background = startBackground();

let stopping = false;
async function stop() {
  if (stopping) return;
  stopping = true;
  // Whatever happens below, the process is gone before `npm start` would resort to SIGKILL (5 s).
  setTimeout(() => process.exit(0), 4500).unref();
  const closed = new Promise((resolve) => server.close(resolve));
  server.closeAllConnections();
  await Promise.all([closed, background.stop().catch((error) => console.error('[jobs] stopping:', error))]);
  process.exit(0);
}
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
