import { estimate, sampleRateBook } from '../src/lib/estimate/index.ts';
const rb = { ...sampleRateBook(), minimumJobCents: 0 };
const mk = (length: number, steps: number) => ({
  rooms: [{ name: 'T', ceilingHeight: 84 + 7 * 5, walls: [
    { length, outlets: 0, openings: [{ kind: 'door', width: 65, sillHeight: 9, offset: 137, count: 1 }, { kind: 'door', sillHeight: 9, offset: 249, count: 1 }] },
    { length, outlets: 0, stair: { steps, rise: 5, run: 10, startsAt: 'left' } },
  ], treatment: { id: 'flat-panel', height: 'wainscot', wainscotHeight: 38 } }],
  builtBefore1978: 'no', measuredBy: 'homeowner-estimate', paint: false, photoCount: 0,
});
for (const s of [6, 7]) { const e = estimate(mk(479, s), rb); console.log(s, e.price.totalCents); }
