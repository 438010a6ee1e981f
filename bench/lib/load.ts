/**
 * A small closed-loop HTTP load generator on `node:http`: N virtual clients, each with its own
 * keep-alive connection, sending one request after another (no pipelining) for a warm-up and then
 * a measured window. Latency is recorded per request started in the measured window.
 *
 * Each client's socket can be bound to its own loopback address (127.0.0.0/8 is all local on Linux),
 * so a server that keys anything on the peer address sees distinct clients. A client moves to a
 * fresh address when `addressBudget` requests have used the current one (a new connection then).
 */
import { Agent, request as httpRequest } from 'node:http';

export type LoadRequest = { path: string; body: Buffer; headers?: Record<string, string> };

export type LoadOptions = {
  port: number;
  connections: number;
  warmupMs: number;
  durationMs: number;
  /** The request a client sends next, given the address it sends from and its running count. */
  next: (client: number, address: string, sequence: number) => LoadRequest;
  /** Hands out a loopback address never used before (each one a fresh client for the server). */
  freshAddress: () => string;
  /** Requests per address before the client moves to a fresh one (Infinity: never). */
  addressBudget: number;
};

export type LoadResult = {
  requests: number;
  durationS: number;
  requestsPerS: number;
  p50Ms: number;
  p95Ms: number;
  p99Ms: number;
  maxMs: number;
  statuses: Record<string, number>;
  non200: number;
  errors: number;
  addressesUsed: number;
  firstFailure?: string;
};

export async function runLoad(options: LoadOptions): Promise<LoadResult> {
  const start = performance.now();
  const measureFrom = start + options.warmupMs;
  const stopAt = measureFrom + options.durationMs;
  const latencies: number[] = [];
  const statuses: Record<string, number> = {};
  let errors = 0;
  let addressesUsed = 0;
  let lastDone = measureFrom;
  let firstFailure: string | undefined;

  async function client(index: number): Promise<void> {
    let address = options.freshAddress();
    addressesUsed++;
    let agent = new Agent({ keepAlive: true, maxSockets: 1, localAddress: address });
    let onAddress = 0;
    for (let sequence = 0; ; sequence++) {
      const t0 = performance.now();
      if (t0 >= stopAt) break;
      if (onAddress >= options.addressBudget) {
        agent.destroy();
        address = options.freshAddress();
        addressesUsed++;
        agent = new Agent({ keepAlive: true, maxSockets: 1, localAddress: address });
        onAddress = 0;
      }
      onAddress++;
      const req = options.next(index, address, sequence);
      const measured = t0 >= measureFrom;
      try {
        const { status, text } = await send(agent, options.port, req);
        const t1 = performance.now();
        if (measured) {
          latencies.push(t1 - t0);
          statuses[status] = (statuses[status] ?? 0) + 1;
          lastDone = Math.max(lastDone, t1);
        }
        if (status !== 200 && !firstFailure) firstFailure = `${status} ${text.slice(0, 300)}`;
      } catch (error) {
        if (measured) errors++;
        if (!firstFailure) firstFailure = String(error);
      }
    }
    agent.destroy();
  }

  await Promise.all(Array.from({ length: options.connections }, (_, i) => client(i)));
  latencies.sort((a, b) => a - b);
  const at = (q: number) => latencies[Math.min(latencies.length - 1, Math.floor(q * latencies.length))] ?? NaN;
  const durationS = (lastDone - measureFrom) / 1000;
  const non200 = Object.entries(statuses).reduce((sum, [status, count]) => sum + (status === '200' ? 0 : count), 0);
  return {
    requests: latencies.length,
    durationS,
    requestsPerS: latencies.length / durationS,
    p50Ms: at(0.5),
    p95Ms: at(0.95),
    p99Ms: at(0.99),
    maxMs: latencies.at(-1) ?? NaN,
    statuses,
    non200,
    errors,
    addressesUsed,
    firstFailure,
  };
}

function send(agent: Agent, port: number, req: LoadRequest): Promise<{ status: number; text: string }> {
  return new Promise((resolve, reject) => {
    const outgoing = httpRequest(
      {
        agent,
        host: '127.0.0.1',
        port,
        method: 'POST',
        path: req.path,
        headers: { 'Content-Type': 'application/json', 'Content-Length': req.body.length, ...req.headers },
      },
      (response) => {
        const chunks: Buffer[] = [];
        response.on('data', (chunk: Buffer) => chunks.push(chunk));
        response.on('end', () => resolve({ status: response.statusCode ?? 0, text: Buffer.concat(chunks).toString('utf8') }));
        response.on('error', reject);
      },
    );
    outgoing.on('error', reject);
    outgoing.end(req.body);
  });
}

/** 127.0.0.2, 127.0.0.3, … 127.0.0.254, 127.0.1.1, … — never 127.0.0.1, which others use. */
export function loopbackAddresses(): () => string {
  let n = 0;
  return () => {
    const third = Math.floor(n / 253);
    const fourth = (n % 253) + (third === 0 ? 2 : 1);
    n++;
    if (third > 255) throw new Error('Out of loopback addresses.');
    return `127.0.${third}.${fourth}`;
  };
}
