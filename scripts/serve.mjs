// Serves the production build (`dist/`). It is Astro's own standalone handler behind a plain
// node:http server, for one reason: Astro 5's Node adapter takes the client address from
// X-Forwarded-For without any check, so anyone could pick a fresh address per request and walk
// past every per-address rate limit. Here the header is removed unless TRUST_PROXY=true (set it only
// behind a proxy that overwrites the header), so the address is the direct peer.
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

const server = http.createServer((req, res) => {
  if (!trustProxy) delete req.headers['x-forwarded-for'];
  res.once('finish', () => discardUnreadBody(req));
  handler(req, res);
});
server.listen(port, host, () => {
  console.log(`Lapwing app server listening on http://${host}:${port}${trustProxy ? ' (trusting X-Forwarded-For)' : ''}`);
});

function stop() {
  server.close(() => process.exit(0));
  server.closeAllConnections();
  setTimeout(() => process.exit(0), 3000).unref();
}
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
