/**
 * One wall drawn to scale as a clean line elevation (SVG): boards with their gaps and the ripped last
 * board, battens or frames, cap rail and baseboard, doors and windows left open, outlet and switch
 * cut-outs, and dimension lines in the firm's units. Coordinates are inches with the floor at the
 * bottom; the SVG scales to its container, so it stays readable on a phone.
 */
import { useId } from 'react';
// Direct module imports keep the browser bundle free of the core's schemas (and zod).
import type { TreatmentKind } from '~/lib/estimate/schemas.ts';
import type { WallPiece, WallTakeoff } from '~/lib/estimate/types.ts';
import type { DrawnPiece } from '~/lib/shared/homeowner-estimate.ts';
import { wallSummary } from '~/lib/estimate/summary.ts';
import { formatLength, type Units } from '~/lib/estimate/units.ts';
import { beadLines, MAX_FRAME_PX, roomFrame, wallFrame, wallToFrame, type RoomFrame } from './drawing-layout.ts';
import { FixtureOutline } from './FixtureOutline.tsx';

export interface WallDrawingProps {
  wall: Omit<WallTakeoff, 'pieces'> & { pieces: DrawnPiece[] };
  units: Units;
  /** Shown in the text alternative, e.g. "Vertical shiplap". */
  treatmentName?: string;
  /** Beadboard panels are drawn with their beads. */
  treatmentKind?: TreatmentKind;
  /** The frame shared by every wall of the room (roomFrameFor), so they are drawn to one scale; the wall's own when left out. */
  frame?: RoomFrame;
  className?: string;
}

/** The shared frame for a room's walls, so a 5 ft wall is drawn shorter than an 8 ft one beside it. */
export function roomFrameFor(walls: readonly Pick<WallTakeoff, 'length' | 'ceilingHeight' | 'bandTop' | 'bandBottom' | 'rake'>[], units: Units): RoomFrame {
  return roomFrame(walls.map((w) => wallToFrame(w, (x) => formatLength(x, units))));
}

/** Beadboard beads are drawn about this far apart (drawing only, not priced): from memory. */
const BEAD_SPACING = 2;

const INK = '#1F2A2E';
const PAPER = '#FFFFFF';
const WOOD = '#EEDFC0';
const WOOD_TRIM = '#DCC59A';
const GAP = '#6E5A3E';
const SLATE = '#5B6B73';

const FILL: Record<WallPiece['role'], string> = {
  board: WOOD,
  strip: WOOD,
  panel: WOOD,
  batten: WOOD_TRIM,
  stile: WOOD_TRIM,
  rail: WOOD_TRIM,
  frame: 'none',
  'cap-rail': WOOD_TRIM,
  baseboard: WOOD_TRIM,
};

const r = (x: number): number => Math.round(x * 1000) / 1000;

export function WallDrawing({ wall, units, treatmentName, treatmentKind, frame: sharedFrame, className }: WallDrawingProps) {
  const id = useId();
  const titleId = `${id}-title`;
  const descId = `${id}-desc`;
  const L = wall.length;
  const H = wall.ceilingHeight;
  const len = (x: number): string => formatLength(x, units);
  const sides = wallToFrame(wall, len);
  // Text and margins come from the room's frame, so every wall of a room has one scale and one label size.
  const frame = sharedFrame ?? roomFrame([sides]);
  const { viewBox, widthShare } = wallFrame(sides, frame);
  const font = frame.font;
  const y = (fromFloor: number): number => r(H - fromFloor);
  const beads = treatmentKind === 'beadboard';
  const shiplap = wall.boards !== undefined;
  const tick = font * 0.45;

  const hDim = (x0: number, x1: number, atY: number, label: string, key: string) => (
    <g key={key} className="dimension">
      <line x1={r(x0)} y1={r(atY)} x2={r(x1)} y2={r(atY)} stroke={INK} strokeWidth={1} vectorEffect="non-scaling-stroke" />
      <line x1={r(x0)} y1={r(atY - tick)} x2={r(x0)} y2={r(atY + tick)} stroke={INK} strokeWidth={1} vectorEffect="non-scaling-stroke" />
      <line x1={r(x1)} y1={r(atY - tick)} x2={r(x1)} y2={r(atY + tick)} stroke={INK} strokeWidth={1} vectorEffect="non-scaling-stroke" />
      <text x={r((x0 + x1) / 2)} y={r(atY + font * 1.25)} fontSize={r(font)} textAnchor="middle" fill={INK}>
        {label}
      </text>
    </g>
  );
  const vDim = (y0: number, y1: number, atX: number, label: string, key: string, anchor: 'start' | 'end') => (
    <g key={key} className="dimension">
      <line x1={r(atX)} y1={y(y0)} x2={r(atX)} y2={y(y1)} stroke={INK} strokeWidth={1} vectorEffect="non-scaling-stroke" />
      <line x1={r(atX - tick)} y1={y(y0)} x2={r(atX + tick)} y2={y(y0)} stroke={INK} strokeWidth={1} vectorEffect="non-scaling-stroke" />
      <line x1={r(atX - tick)} y1={y(y1)} x2={r(atX + tick)} y2={y(y1)} stroke={INK} strokeWidth={1} vectorEffect="non-scaling-stroke" />
      <text
        x={r(anchor === 'end' ? atX - font * 0.5 : atX + font * 0.5)}
        y={r((y(y0) + y(y1)) / 2 + font * 0.35)}
        fontSize={r(font)}
        textAnchor={anchor}
        fill={INK}
      >
        {label}
      </text>
    </g>
  );

  const lastRipped = wall.boards && wall.boards.lastWidth < wall.boards.boardWidth - 1e-6;
  const rippedPiece = lastRipped ? wall.pieces.filter((p) => p.ripped).at(-1) : undefined;

  return (
    <svg
      className={className}
      role="img"
      aria-labelledby={`${titleId} ${descId}`}
      viewBox={`${r(viewBox.x)} ${r(viewBox.y)} ${r(viewBox.w)} ${r(viewBox.h)}`}
      width={`${r(widthShare * 100)}%`}
      preserveAspectRatio="xMidYMid meet"
      style={{
        fontFamily: "'DM Sans', system-ui, sans-serif",
        fontVariantNumeric: 'tabular-nums',
        maxWidth: `${r(widthShare * MAX_FRAME_PX)}px`,
        height: 'auto',
      }}
      data-scale={r(frame.width)}
      data-wall={wall.label}
    >
      <title id={titleId}>{`${wall.label}, drawn to scale`}</title>
      <desc id={descId}>{wallSummary(wall, units, treatmentName)}</desc>

      {/* The wall */}
      <rect x={0} y={0} width={r(L)} height={r(H)} fill={PAPER} stroke={INK} strokeWidth={1.25} vectorEffect="non-scaling-stroke" />

      {/* Shiplap gaps read as darker lines: the band is dark and the boards sit on it. */}
      {shiplap && <rect className="gaps" x={0} y={y(wall.bandTop)} width={r(L)} height={r(wall.bandTop - wall.bandBottom)} fill={GAP} />}

      <g className="pieces">
        {wall.pieces.map((p, i) => (
          <rect
            key={i}
            data-role={p.role}
            x={r(p.x)}
            y={y(p.y + p.height)}
            width={r(p.width)}
            height={r(p.height)}
            fill={FILL[p.role]}
            stroke={p.role === 'frame' ? INK : shiplap && (p.role === 'board' || p.role === 'strip') ? 'none' : INK}
            strokeWidth={p.role === 'frame' ? 1.25 : 0.5}
            vectorEffect="non-scaling-stroke"
          />
        ))}
      </g>

      {/* Butt joints where merged boards meet, each on a stud and staggered from the row below (staggered-joints.ts). */}
      <g className="joints">
        {wall.pieces.flatMap((p, i) =>
          (p.joints ?? []).map((jx, j) => (
            <line
              key={`${i}-${j}`}
              data-part="joint"
              x1={r(jx)}
              y1={y(p.y + p.height)}
              x2={r(jx)}
              y2={y(p.y)}
              stroke={GAP}
              strokeWidth={1}
              vectorEffect="non-scaling-stroke"
            />
          )),
        )}
      </g>

      {/* Beadboard's beads: thin lines down each panel at the bead spacing. */}
      {beads && (
        <g className="beads">
          {wall.pieces
            .filter((p) => p.role === 'panel')
            .flatMap((p, i) =>
              beadLines(p, BEAD_SPACING).map((bx) => (
                <line
                  key={`${i}-${bx}`}
                  data-part="bead"
                  x1={bx}
                  y1={y(p.y + p.height)}
                  x2={bx}
                  y2={y(p.y)}
                  stroke={WOOD_TRIM}
                  strokeWidth={1}
                  vectorEffect="non-scaling-stroke"
                />
              )),
            )}
        </g>
      )}

      {/* Casings around doors and windows: the treatment stops at their outside edge. */}
      <g className="casings">
        {wall.openings
          .filter((o) => (o.casingWidth ?? 0) > 0)
          .map((o, i) => {
            const c = o.casingWidth ?? 0;
            const x0 = Math.max(0, o.offset - c);
            const x1 = Math.min(L, o.offset + o.width + c);
            return (
              <rect
                key={i}
                data-part="casing"
                x={r(x0)}
                y={y(o.sillHeight + o.height + c)}
                width={r(x1 - x0)}
                height={r(o.height + c)}
                fill={PAPER}
                stroke={INK}
                strokeWidth={0.75}
                vectorEffect="non-scaling-stroke"
              />
            );
          })}
      </g>

      {/* Doors and windows are left open (white), outlined in ink. */}
      <g className="openings">
        {wall.openings.map((o, i) => (
          <rect
            key={i}
            data-kind={o.kind}
            x={r(o.offset)}
            y={y(o.sillHeight + o.height)}
            width={r(o.width)}
            height={r(o.height)}
            fill={PAPER}
            stroke={INK}
            strokeWidth={1}
            strokeDasharray={o.assumed ? '4 3' : undefined}
            vectorEffect="non-scaling-stroke"
          />
        ))}
      </g>

      {/* Fixtures as outlines at their place: the treatment stops at some and runs behind others. */}
      {wall.fixtures && wall.fixtures.length > 0 && (
        <g className="fixtures">
          {wall.fixtures.map((f, i) => (
            <FixtureOutline key={i} fixture={f} top={y(f.height)} font={font} />
          ))}
        </g>
      )}

      {/* Outlet and switch cut-outs as small outlined rectangles. */}
      <g className="boxes">
        {wall.boxes.map((b, i) => (
          <rect
            key={i}
            data-kind={b.kind}
            data-covered={b.covered ? 'yes' : 'no'}
            x={r(b.offset)}
            y={y(b.bottom + b.height)}
            width={r(b.width)}
            height={r(b.height)}
            fill={PAPER}
            stroke={INK}
            strokeWidth={1}
            vectorEffect="non-scaling-stroke"
          />
        ))}
      </g>

      {/* On a stair wall: the nosing line, and the band's bottom edge following it, level past the stair. */}
      {wall.rake && <RakeLines rake={wall.rake} length={L} bandBottom={wall.bandBottom} y={y} />}

      {/* Dimensions as the homeowner typed them: length below, ceiling height on the left, and on the right
          the top of a wainscot from the floor (on a stair wall, the band's height above the nosing line). */}
      {hDim(0, L, H + font * 1.2, len(L), 'length')}
      {vDim(0, H, -font * 1.2, sides.leftLabel, 'ceiling', 'end')}
      {sides.rightLabel !== undefined &&
        (wall.rake
          ? vDim(wall.bandBottom, wall.bandTop, L + font * 1.2, sides.rightLabel, 'band', 'start')
          : vDim(0, wall.bandTop, L + font * 1.2, sides.rightLabel, 'band', 'start'))}
      {rippedPiece && wall.boards?.orientation === 'vertical' && (
        <text className="ripped" x={r(rippedPiece.x + rippedPiece.width / 2)} y={r(-font * 0.4)} fontSize={r(font)} textAnchor="middle" fill={SLATE}>
          {`last ${len(rippedPiece.width)}`}
        </text>
      )}
    </svg>
  );
}

/** The nosing line from its low end to its high end, level to the wall end beyond; the band's bottom `bandBottom` above it. */
function RakeLines({
  rake,
  length,
  bandBottom,
  y,
}: {
  rake: NonNullable<WallTakeoff['rake']>;
  length: number;
  bandBottom: number;
  y: (fromFloor: number) => number;
}) {
  const [low, high] = rake;
  const end = high.x >= low.x ? length : 0;
  const line = (lift: number): string => [low, high, { x: end, y: high.y }].map((p) => `${r(p.x)},${y(p.y + lift)}`).join(' ');
  return (
    <g className="rake">
      <polyline data-role="nosing-line" points={line(0)} fill="none" stroke={INK} strokeWidth={1.25} vectorEffect="non-scaling-stroke" />
      <polyline
        data-role="band-bottom"
        points={line(bandBottom)}
        fill="none"
        stroke={SLATE}
        strokeWidth={1}
        strokeDasharray="4 3"
        vectorEffect="non-scaling-stroke"
      />
    </g>
  );
}

export default WallDrawing;
