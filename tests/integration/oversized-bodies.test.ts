import { connect } from 'node:net';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { startAppServer, type AppServer } from '../helpers/app-server';

/**
 * A client that, like many, sends the whole body before it reads the answer (plain HTTP/1.1 over a
 * socket, so no client library's own shortcuts get in the way). The app refuses the body at once
 * (413); the server must still let the client finish sending, or the client sees a broken
 * connection (EPIPE, or a reset) instead of the refusal.
 */
function postInFull(origin: string, path: string, headers: Record<string, string>, size: number): Promise<{ status: number; body: string }> {
  const { hostname, port } = new URL(origin);
  return new Promise((resolve, reject) => {
    const socket = connect({ host: hostname, port: Number(port) });
    let received = '';
    // Done once every byte went out and the server has finished its answer; an error before then fails.
    let sentAll = false;
    let answered = false;
    const settle = () => {
      if (!sentAll || !answered) return;
      const status = Number(received.match(/^HTTP\/1\.1 (\d{3})/)?.[1] ?? 0);
      resolve({ status, body: received.slice(received.indexOf('\r\n\r\n') + 4) });
    };
    socket.setEncoding('latin1');
    socket.on('data', (chunk: string) => (received += chunk));
    socket.on('error', reject);
    socket.on('end', () => {
      answered = true;
      settle();
    });
    socket.on('connect', () => {
      const head = [
        `POST ${path} HTTP/1.1`,
        `Host: ${hostname}:${port}`,
        `Content-Length: ${size}`,
        ...Object.entries(headers).map(([name, value]) => `${name}: ${value}`),
      ];
      socket.write(`${head.join('\r\n')}\r\n\r\n`);
      const chunk = Buffer.alloc(64 * 1024, 'x');
      let sent = 0;
      const writeMore = () => {
        while (sent < size) {
          const piece = chunk.subarray(0, Math.min(chunk.length, size - sent));
          sent += piece.length;
          if (!socket.write(piece)) return void socket.once('drain', writeMore);
        }
        // All sent; the answer is read until the server closes its side.
        socket.end(() => {
          sentAll = true;
          settle();
        });
      };
      writeMore();
    });
  });
}

describe('oversized request bodies through the production server', () => {
  let app: AppServer;

  beforeAll(async () => {
    app = await startAppServer(process.env);
  }, 60_000);

  afterAll(async () => {
    await app?.stop();
  });

  test('a 20 MB sign-in form gets the 413 page, not a broken connection', async () => {
    const answer = await postInFull(app.origin, '/login', { 'content-type': 'application/x-www-form-urlencoded', origin: app.origin }, 20 * 1024 * 1024);
    expect(answer.status).toBe(413);
    expect(answer.body).toContain('The form is too large to read.');
    expect(app.alive()).toBe(true);
  });

  test('a 20 MB JSON body gets the 413 JSON answer', async () => {
    const answer = await postInFull(app.origin, '/api/embed/cedar-hollow/estimate', { 'content-type': 'application/json' }, 20 * 1024 * 1024);
    expect(answer.status).toBe(413);
    expect(answer.body).toContain('{"error":"The request is too large."}');
    expect(app.alive()).toBe(true);
  });
});
