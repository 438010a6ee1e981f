/**
 * Benchmark of the open visit slots the widget's visit step and the booking check compute: the
 * whole team's slots (six salespeople, two ranges each weekday, a 15-minute step, 28 days ahead,
 * four visits a day each already booked), by the pure `openSlots`, p95 beside its limit; and one
 * person's worst case allowed by the input limits (366 days, a one-minute step) for scale.
 *
 * Run: npm run bench visits. Pure computation: no database. The hours and visits are invented.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { openSlots, type OpenSlotsInput } from '../src/lib/visits/index.ts';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
// Our own budget: the team's slots well inside the 0.5 s the widget's live range answers in,
// leaving most of it to the database and the network.
const TARGET_TEAM_P95_MS = 25;
const WARMUP = 30;
const RUNS = 300;
const PEOPLE = 6;

const now = new Date('2026-10-19T13:00:00Z'); // a Monday morning in New York, the week before London's clocks change
const weekday = [
  { from: '08:30', to: '12:00' },
  { from: '13:00', to: '17:30' },
];
function personInput(index: number): OpenSlotsInput {
  const busy = [];
  for (let day = 1; day <= 28; day++) {
    for (let visit = 0; visit < 4; visit++) {
      const start = new Date(now.getTime() + day * 86_400_000 + (visit * 2 + (index % 2)) * 3_600_000);
      busy.push({ start, end: new Date(start.getTime() + 3_600_000) });
    }
  }
  return {
    timeZone: index % 2 ? 'Europe/London' : 'America/New_York',
    weekly: { mon: weekday, tue: weekday, wed: weekday, thu: weekday, fri: weekday, sat: [{ from: '09:00', to: '12:00' }] },
    daysOff: ['2026-10-30', '2026-11-11'],
    visitMinutes: 60,
    bufferMinutes: 30,
    stepMinutes: 15,
    minNoticeMinutes: 24 * 60,
    horizonDays: 28,
    busy,
    now,
  };
}

const inputs = Array.from({ length: PEOPLE }, (_, i) => personInput(i));
const team = () => inputs.reduce((count, input) => count + openSlots(input).length, 0);

const times: number[] = [];
let slots = 0;
for (let i = 0; i < WARMUP + RUNS; i++) {
  const started = performance.now();
  slots = team();
  if (i >= WARMUP) times.push(performance.now() - started);
}
times.sort((a, b) => a - b);
const pick = (q: number) => times[Math.min(times.length - 1, Math.floor(q * times.length))]!;

const worst: OpenSlotsInput = {
  ...personInput(0),
  weekly: { mon: [{ from: '00:00', to: '23:59' }], tue: [{ from: '00:00', to: '23:59' }] },
  stepMinutes: 1,
  horizonDays: 366,
  busy: [],
};
const worstStarted = performance.now();
const worstSlots = openSlots(worst).length;
const worstMs = performance.now() - worstStarted;

const round = (n: number) => Math.round(n * 1000) / 1000;
const figures = {
  teamMedianMs: round(pick(0.5)),
  teamP95Ms: round(pick(0.95)),
  teamSlots: slots,
  people: PEOPLE,
  runs: RUNS,
  worstCaseOnePersonMs: round(worstMs),
  worstCaseSlots: worstSlots,
  node: process.version,
};
const passed = figures.teamP95Ms <= TARGET_TEAM_P95_MS;
console.log(
  `visits: the team's open slots (${PEOPLE} people, 28 days, 15-minute step): median ${figures.teamMedianMs} ms, p95 ${figures.teamP95Ms} ms (${slots} slots)`,
);
console.log(
  `  target: p95 at most ${TARGET_TEAM_P95_MS} ms — ${passed ? 'met' : 'NOT met'} (p95 ÷ limit = ${round(figures.teamP95Ms / TARGET_TEAM_P95_MS)}); worst case of one person: ${figures.worstCaseOnePersonMs} ms for ${worstSlots} slots`,
);
const out = join(root, 'bench', 'results', 'visits.json');
mkdirSync(dirname(out), { recursive: true });
writeFileSync(out, `${JSON.stringify({ name: 'visits', figures, target: { teamP95Ms: TARGET_TEAM_P95_MS }, passed }, null, 2)}\n`);
