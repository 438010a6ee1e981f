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
// Environment: HOST (default 127.0.0.1), PORT (default 4321), TRUST_PROXY, and the app's settings
// (src/lib/server/config.ts), all checked before the server listens.
import http from 'node:http';

// A wrong or missing setting stops the start here, with every bad variable named, rather than
// surfacing later as failed requests or e-mails that link to the wrong address.
const { checkEnvironment } = await import('../dist/server/config-check.mjs');
const checked = checkEnvironment(process.env);
if (!checked.ok) {
  process.stderr.write(`${checked.error.message}\n`);
  process.exit(1);
}

process.env.ASTRO_NODE_AUTOSTART = 'disabled';
const { handler } = await import('../dist/server/entry.mjs');
const { startBackground } = await import('../dist/server/background.mjs');

const { HOST: host, PORT: port } = checked.settings;
const trustProxy = checked.settings.TRUST_PROXY === 'true';

// Most clients read the answer only once they have sent the whole body. When the app answers
// without reading all of it (a 413 for a body over its limit, a 429 or 403 before reading), the
// rest is read and dropped so the client can finish and see the answer; closing the connection
// instead would show it a broken pipe. Past this much the connection is dropped after all.
const MAX_DISCARDED_BYTES = 64 * 1024 * 1024;

function discardUnreadBody(req) {
  if (req.complete || req.destroyed) return;
  let discarded = 0;
  const discard = () => {
    let chunk;
    while ((chunk = req.read()) !== null) {
      discarded += chunk.length;
      if (discarded > MAX_DISCARDED_BYTES) {
        req.off('readable', discard);
        req.destroy();
        return;
      }
    }
  };
  req.on('readable', discard);
  discard();
}

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
  res.once('finish', () => discardUnreadBody(req));
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
