import { useState } from 'react';
import { LengthField } from '~/components/forms/LengthField';
import { boardRun } from '~/lib/estimate/board-run';
import { formatLength, parseLength } from '~/lib/estimate/units';

type Parsed = { ok: true; inches: number } | { ok: false; message: string };

function parse(text: string): Parsed {
  try {
    return { ok: true, inches: parseLength(text, 'imperial') };
  } catch (error) {
    return { ok: false, message: error instanceof Error ? error.message : 'Not a length' };
  }
}

/** A small hands-on taste of the estimating core on the landing page: one run of boards. */
export default function BoardRunTry() {
  const [wall, setWall] = useState('11\' 4"');
  const [board, setBoard] = useState('5 1/2');
  const [gap, setGap] = useState('1/8');
  const inputs = { wall: parse(wall), board: parse(board), gap: parse(gap) };

  let result: string;
  if (!inputs.wall.ok || !inputs.board.ok || !inputs.gap.ok) {
    result = 'Type lengths the way a tape reads, like 11\' 4" or 5 1/2.';
  } else if (inputs.wall.inches <= 0 || inputs.board.inches <= 0) {
    result = 'Wall and board widths need to be more than zero.';
  } else {
    const run = boardRun(inputs.wall.inches, inputs.board.inches, inputs.gap.inches);
    const last = run.lastWidth === inputs.board.inches ? 'every board full width' : `the last one ripped to ${formatLength(run.lastWidth, 'imperial')}`;
    result = `${run.count} boards, ${last}.`;
  }

  return (
    <fieldset className="mt-4 grid max-w-2xl gap-4 rounded-lg border border-slate/20 bg-white p-5 sm:grid-cols-3" aria-label="Try a wall">
      <LengthField label="Wall width" value={wall} onChange={setWall} error={inputs.wall.ok ? undefined : inputs.wall.message} />
      <LengthField label="Board width" value={board} onChange={setBoard} error={inputs.board.ok ? undefined : inputs.board.message} />
      <LengthField label="Gap between boards" value={gap} onChange={setGap} error={inputs.gap.ok ? undefined : inputs.gap.message} />
      <p className="figures sm:col-span-3 text-lg font-medium" data-testid="board-result" aria-live="polite">
        {result}
      </p>
    </fieldset>
  );
}
