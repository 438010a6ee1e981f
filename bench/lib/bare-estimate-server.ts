/**
 * The baseline for the widget benchmark: a bare `node:http` server that does only what the estimate
 * endpoint must do at its core — read the JSON body, validate the project once, run the estimating
 * core with a rate book parsed once, answer the homeowner's view as JSON. No framework, database, form token or rate limits.
 *
 * Started by bench/widget.bench.ts as `node --import tsx bench/lib/bare-estimate-server.ts` with
 * BENCH_RATE_BOOK (the published rate book's JSON). Listens on a free loopback port and prints
 * `listening <port>` once ready.
 */
import { createServer } from 'node:http';
import { estimateParsed, projectSchema } from '../../src/lib/estimate/index.ts';
import { storedRateBook } from '../../src/lib/server/rates/stored-rate-book.ts';
import { presentForHomeowner } from '../../src/lib/server/estimates/present-estimate.ts';

// BENCH_RATE_BOOK is the published version's stored data (a versioned envelope).
const rateBook = storedRateBook.read(JSON.parse(process.env.BENCH_RATE_BOOK ?? 'null'));

const server = createServer((request, response) => {
  const chunks: Buffer[] = [];
  request.on('data', (chunk: Buffer) => chunks.push(chunk));
  request.on('end', () => {
    let status = 200;
    let body: unknown;
    try {
      const { project } = JSON.parse(Buffer.concat(chunks).toString('utf8')) as { project: unknown };
      body = { estimate: presentForHomeowner(estimateParsed(projectSchema.parse(project), rateBook)) };
    } catch (error) {
      status = 400;
      body = { error: error instanceof Error ? error.message : 'bad request' };
    }
    const json = JSON.stringify(body);
    response.writeHead(status, { 'Content-Type': 'application/json', 'Content-Length': Buffer.byteLength(json) });
    response.end(json);
  });
});

server.listen(0, '127.0.0.1', () => {
  const address = server.address();
  console.log(`listening ${typeof address === 'object' && address ? address.port : 0}`);
});

for (const signal of ['SIGTERM', 'SIGINT'] as const) process.on(signal, () => server.close(() => process.exit(0)));
