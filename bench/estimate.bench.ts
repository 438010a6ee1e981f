/**
 * Benchmark of the estimating core: a six-room, three-treatment project end to end (validation,
 * takeoff, materials, labour, price) and the sheet layout search on its own.
 * Run: npx tsx bench/estimate.bench.ts — writes bench/results/estimate.json.
 * The project below is invented demo data.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { estimate, estimateParsed, parseRateBook, piecesPerSheet, projectSchema, sampleRateBook, type ProjectInput } from '../src/lib/estimate/index.ts';
import { clearSheetLayoutMemo } from '../src/lib/estimate/sheet-layout.ts';

const TARGET_MS = 2;

function sixRooms(): ProjectInput {
  const room = (name: string, id: string, height: 'wainscot' | 'full', l: number, w: number, extra: Partial<ProjectInput['rooms'][number]> = {}) => ({
    name,
    ceilingHeight: 96,
    length: l,
    width: w,
    walls: [
      { side: 'length' as const, openings: [{ kind: 'window' as const, count: 2 }], outlets: 2 },
      { side: 'width' as const, openings: [{ kind: 'door' as const }], outlets: 1, switches: 1 },
      { side: 'length' as const, outlets: 2 },
      { side: 'width' as const, openings: [{ kind: 'window' as const }], outlets: 1 },
    ],
    treatment: { id, height },
    replaceBaseboard: true,
    ...extra,
  });
  return {
    rooms: [
      room('Dining room', 'board-and-batten', 'wainscot', 168, 144),
      room('Living room', 'shiplap-vertical-ply', 'full', 216, 180),
      room('Hallway', 'picture-frame', 'wainscot', 240, 42),
      room('Main bedroom', 'shiplap-vertical-ply', 'full', 180, 156),
      room('Office', 'board-and-batten', 'full', 132, 120, { ceilingHeight: 108 }),
      room('Powder room', 'picture-frame', 'wainscot', 72, 60, { damp: true }),
    ],
    paint: true,
    builtBefore1978: 'not-sure',
    measuredBy: 'homeowner-tape',
    photoCount: 2,
    tripZone: 'outer',
  };
}

function measure(fn: () => void, warmup: number, iterations: number): { medianMs: number; p95Ms: number; iterations: number } {
  for (let i = 0; i < warmup; i++) fn();
  const times = new Float64Array(iterations);
  for (let i = 0; i < iterations; i++) {
    const t0 = performance.now();
    fn();
    times[i] = performance.now() - t0;
  }
  times.sort();
  const at = (q: number): number => times[Math.min(iterations - 1, Math.floor(q * iterations))]!;
  return { medianMs: at(0.5), p95Ms: at(0.95), iterations };
}

const rateBookInput = sampleRateBook();
const rateBook = parseRateBook(rateBookInput);
const project = sixRooms();

// End to end from raw JSON, as the API receives it (rate book parsed each time too).
const endToEnd = measure(() => estimate(project, rateBookInput), 300, 3000);
// With the rate book already parsed (as a server that caches the published version would).
const parsedBook = measure(() => estimateParsed(projectSchema.parse(project), rateBook), 300, 3000);

// Sheet layout search, cold (memo cleared each time) over a spread of strip and panel sizes.
const pieces = [
  { width: 4.5, height: 35 },
  { width: 5.875, height: 90.75 },
  { width: 3.5, height: 26.5 },
  { width: 7.25, height: 30 },
  { width: 11.875, height: 11.875 },
  { width: 2.5, height: 17 },
];
const sheetCold = measure(
  () => {
    clearSheetLayoutMemo();
    for (const p of pieces) piecesPerSheet({ width: 48, height: 96 }, p, { kerf: 0.125 });
  },
  50,
  500,
);
const perLayoutMs = sheetCold.medianMs / pieces.length;

const e = estimate(project, rateBookInput);
const figures = {
  estimateMedianMs: round(endToEnd.medianMs),
  estimateP95Ms: round(endToEnd.p95Ms),
  estimateParsedRateBookMedianMs: round(parsedBook.medianMs),
  estimateParsedRateBookP95Ms: round(parsedBook.p95Ms),
  sheetLayoutColdMedianMsPerLayout: round(perLayoutMs),
  sheetLayoutColdP95MsForSix: round(sheetCold.p95Ms),
  iterations: endToEnd.iterations,
  rooms: e.takeoff.rooms.length,
  walls: e.takeoff.rooms.reduce((s, r) => s + r.walls.length, 0),
  range: e.price.rangeText,
  node: process.version,
};
const passed = figures.estimateMedianMs < TARGET_MS;

function round(x: number): number {
  return Math.round(x * 1000) / 1000;
}

console.log('Estimating core benchmark');
console.log(`  six-room estimate, end to end:     median ${figures.estimateMedianMs} ms, p95 ${figures.estimateP95Ms} ms`);
console.log(`  same, rate book already parsed:    median ${figures.estimateParsedRateBookMedianMs} ms, p95 ${figures.estimateParsedRateBookP95Ms} ms`);
console.log(`  sheet layout search (cold):        median ${figures.sheetLayoutColdMedianMsPerLayout} ms per layout`);
console.log(`  target: under ${TARGET_MS} ms per six-room estimate on one core — ${passed ? 'met' : 'NOT met'}`);

const out = join(dirname(fileURLToPath(import.meta.url)), 'results', 'estimate.json');
mkdirSync(dirname(out), { recursive: true });
writeFileSync(out, `${JSON.stringify({ name: 'estimate', figures, target: { estimateMedianMs: TARGET_MS }, passed }, null, 2)}\n`);
