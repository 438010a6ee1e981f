import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { newDraft, newRoom, type Draft } from './draft';
import { TreatmentStep } from './TreatmentStep';

const treatments = [
  { id: 'beadboard', name: 'Beadboard', kind: 'beadboard' },
  { id: 'board-and-batten', name: 'Board and batten', kind: 'board-and-batten' },
];

function twoRooms(): Draft {
  const bathroom = { ...newRoom('imperial', 'Bathroom'), length: "8'", width: "5'" };
  const living = { ...newRoom('imperial', 'Living room'), length: "14'", width: "12'" };
  return { ...newDraft('imperial'), treatmentId: 'beadboard', rooms: [bathroom, living] };
}

const render = (draft: Draft, errors = {}) => renderToStaticMarkup(<TreatmentStep treatments={treatments} draft={draft} errors={errors} onChange={() => {}} />);

describe('TreatmentStep', () => {
  it("offers the first room's finish as the next room's, ticked", () => {
    const html = render(twoRooms());
    expect(html).toMatch(/<input type="checkbox"[^>]*checked=""[^>]*\/>The same as the Bathroom/);
  });

  it('lets a room pick one accent wall by the names the homeowner saw on the rooms step', () => {
    const draft = twoRooms();
    draft.rooms[1] = { ...draft.rooms[1]!, accent: { wall: null, finish: { treatmentId: null, height: 'full', wainscotHeight: '' } } };
    const html = render(draft, { 'project.rooms.1.accent.wall': 'Choose the accent wall (one of the walls to cover).' });
    // Source: src/lib/shared/wall-names.ts — clockwise from a wall along the room's length.
    expect(html).toContain('<option value="0">Long wall 1</option><option value="1">Short wall 1</option><option value="2">Long wall 2</option>');
    expect(html).toContain('Choose the accent wall (one of the walls to cover).');
  });
});
