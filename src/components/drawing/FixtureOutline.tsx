/**
 * A fixture drawn as a simple outline at its place on the wall, so the homeowner recognises it: a tub's
 * apron and rim, a vanity's counter and doors, a toilet's tank and bowl, a radiator's sections, a
 * built-in's shelves, a shower's head. Dashed when its size or place was assumed. `top` is the SVG y
 * of its top edge (SVG y runs down from the ceiling).
 */
import type { ReactElement } from 'react';
import type { PlacedFixture } from '~/lib/estimate/types.ts';

const SLATE = '#5B6B73';
const r = (x: number): number => Math.round(x * 1000) / 1000;

export function FixtureOutline({ fixture: f, top, font }: { fixture: PlacedFixture; top: number; font: number }) {
  const x = f.offset;
  const w = f.width;
  const h = f.height;
  const stroke = { stroke: SLATE, strokeWidth: 1, vectorEffect: 'non-scaling-stroke' as const, fill: 'none' };
  const dash = f.assumed ? '4 3' : undefined;
  const line = (x1: number, y1: number, x2: number, y2: number, key: string) => <line key={key} x1={r(x1)} y1={r(y1)} x2={r(x2)} y2={r(y2)} {...stroke} />;
  const details: ReactElement[] = [];
  switch (f.kind) {
    case 'tub':
      // The rim a few inches below the top of the apron.
      details.push(line(x, top + Math.min(3, h * 0.2), x + w, top + Math.min(3, h * 0.2), 'rim'));
      break;
    case 'vanity': {
      const counter = Math.min(1.5, h * 0.1);
      details.push(line(x, top + counter, x + w, top + counter, 'counter'));
      // Two doors under the counter, with a knob each by the middle.
      const inset = Math.min(1.5, w * 0.05);
      const doorTop = top + counter + inset;
      const doorH = h - counter - 2 * inset - Math.min(4, h * 0.12);
      const doorW = (w - 3 * inset) / 2;
      if (doorH > 0 && doorW > 0) {
        details.push(<rect key="door-l" x={r(x + inset)} y={r(doorTop)} width={r(doorW)} height={r(doorH)} {...stroke} />);
        details.push(<rect key="door-r" x={r(x + 2 * inset + doorW)} y={r(doorTop)} width={r(doorW)} height={r(doorH)} {...stroke} />);
      }
      break;
    }
    case 'toilet': {
      // Tank: the upper part, a little narrower than the bowl; the bowl's rim at seat height below it.
      const tankH = h * 0.45;
      const tankInset = w * 0.1;
      details.push(<rect key="tank" x={r(x + tankInset)} y={r(top)} width={r(w - 2 * tankInset)} height={r(tankH)} {...stroke} />);
      const seat = top + h * 0.55;
      details.push(
        <path
          key="bowl"
          d={`M ${r(x)} ${r(seat)} H ${r(x + w)} Q ${r(x + w)} ${r(top + h * 0.85)} ${r(x + w * 0.7)} ${r(top + h * 0.85)} L ${r(x + w * 0.75)} ${r(top + h)} H ${r(x + w * 0.25)} L ${r(x + w * 0.3)} ${r(top + h * 0.85)} Q ${r(x)} ${r(top + h * 0.85)} ${r(x)} ${r(seat)} Z`}
          {...stroke}
        />,
      );
      break;
    }
    case 'radiator': {
      // Sections about 2-1/2 in apart (common practice, no source).
      const n = Math.max(2, Math.round(w / 2.5));
      for (let i = 1; i < n; i++) details.push(line(x + (w * i) / n, top + h * 0.1, x + (w * i) / n, top + h * 0.9, `fin-${i}`));
      break;
    }
    case 'built-in':
      details.push(line(x, top + h / 3, x + w, top + h / 3, 'shelf-1'), line(x, top + (2 * h) / 3, x + w, top + (2 * h) / 3, 'shelf-2'));
      break;
    case 'shower': {
      // The head on its arm near the top, by the left side.
      const armX = x + Math.min(6, w * 0.2);
      details.push(line(armX, top + 2, armX, top + Math.min(10, h * 0.15), 'arm'));
      details.push(line(armX - 2, top + Math.min(10, h * 0.15), armX + 3, top + Math.min(10, h * 0.15), 'head'));
      break;
    }
  }
  return (
    <g data-kind={f.kind} data-placement={f.placement}>
      <rect x={r(x)} y={r(top)} width={r(w)} height={r(h)} {...stroke} strokeDasharray={dash} />
      {details}
      <text x={r(x + w / 2)} y={r(top + h / 2 + font * 0.35)} fontSize={r(font)} textAnchor="middle" fill={SLATE}>
        {f.kind}
      </text>
    </g>
  );
}
