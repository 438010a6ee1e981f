/**
 * An HTTP proxy in front of the S3 stand-in, on a loopback port of its own. Point the app's
 * storage at it (S3_ENDPOINT) and it records every request the app makes, and lets a test act at
 * the moment a request arrives (look at the database, replace an object) before passing it on.
 */
import http from 'node:http';

export type StorageRequest = { method: string; key: string; headers: http.IncomingHttpHeaders };

export type StorageProxy = {
  endpoint: string;
  /** Requests seen, oldest first (presigned browser uploads included, as POST to the bucket). */
  requests: StorageRequest[];
  /** Runs before the request goes on to the stand-in. */
  before: ((request: StorageRequest) => Promise<void>) | undefined;
  /** Runs after the stand-in answered, before the answer goes back to the app. */
  after: ((request: StorageRequest, status: number) => Promise<void>) | undefined;
  close: () => Promise<void>;
};

export async function startStorageProxy(target: string, bucket: string): Promise<StorageProxy> {
  const upstream = new URL(target);
  const proxy: StorageProxy = { endpoint: '', requests: [], before: undefined, after: undefined, close: async () => {} };

  const server = http.createServer((req, res) => {
    const path = decodeURIComponent((req.url ?? '/').split('?')[0]!);
    const prefix = `/${bucket}/`;
    const request: StorageRequest = { method: req.method ?? 'GET', key: path.startsWith(prefix) ? path.slice(prefix.length) : '', headers: req.headers };
    proxy.requests.push(request);
    // Read the whole body first, so the hook runs while the app is waiting for its answer.
    const chunks: Buffer[] = [];
    req.on('data', (chunk: Buffer) => chunks.push(chunk));
    req.on('end', () => void forward());
    const forward = async () => {
      try {
        await proxy.before?.(request);
        const forwarded = http.request({ host: upstream.hostname, port: upstream.port, method: req.method, path: req.url, headers: req.headers }, (answer) => {
          const body: Buffer[] = [];
          answer.on('data', (chunk: Buffer) => body.push(chunk));
          const finish = async () => {
            try {
              await proxy.after?.(request, answer.statusCode ?? 0);
            } catch (error) {
              console.error('storage proxy hook failed:', error);
            }
            res.writeHead(answer.statusCode ?? 502, answer.headers);
            res.end(Buffer.concat(body));
          };
          answer.on('end', () => void finish());
        });
        forwarded.on('error', () => res.writeHead(502).end());
        forwarded.end(Buffer.concat(chunks));
      } catch (error) {
        console.error('storage proxy hook failed:', error);
        res.writeHead(502).end();
      }
    };
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  proxy.endpoint = `http://127.0.0.1:${(server.address() as { port: number }).port}`;
  proxy.close = () => new Promise((resolve) => server.close(() => resolve()));
  return proxy;
}
