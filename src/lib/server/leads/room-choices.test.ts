import { describe, expect, it } from 'vitest';
import { estimate, sampleRateBook } from '~/lib/estimate';
import type { Company } from '../companies/company.entity';
import { presentForHomeowner } from '../estimates/present-estimate';
import { homeownerConfirmation, newLeadAlert } from './lead-mail';
import { describeRoomChoice, roomChoices } from './room-choices';

// Demo scenario: a bathroom in beadboard, a living room in beadboard with one full-height accent
// wall in board and batten, as the price widget sends them (the accent wall as its own room).
const walls = (labels: string[]) => labels.map((label, i) => ({ label, side: i % 2 === 0 ? ('length' as const) : ('width' as const) }));
const project = {
  rooms: [
    {
      name: 'Bathroom',
      ceilingHeight: 96,
      length: 96,
      width: 60,
      damp: true,
      walls: walls(['Long wall 1', 'Short wall 1', 'Long wall 2', 'Short wall 2']),
      treatment: { id: 'beadboard', height: 'wainscot' as const, wainscotHeight: 48 },
    },
    {
      name: 'Living room',
      ceilingHeight: 96,
      length: 168,
      width: 144,
      walls: walls(['Long wall 1', 'Long wall 2']),
      treatment: { id: 'beadboard', height: 'wainscot' as const, wainscotHeight: 36 },
    },
    {
      name: 'Living room — accent wall',
      ceilingHeight: 96,
      length: 168,
      width: 144,
      walls: [{ label: 'Short wall 1', side: 'width' as const }],
      treatment: { id: 'board-and-batten', height: 'full' as const },
    },
  ],
  builtBefore1978: 'no' as const,
  measuredBy: 'homeowner-estimate' as const,
};
// Source: src/lib/estimate/sample-data.ts (the demo rate book names the treatments).
const result = estimate(project, sampleRateBook());

describe('what the homeowner chose, per room', () => {
  it('folds the accent wall back into its room, with each finish, height and the walls covered', () => {
    expect(roomChoices(result.takeoff.rooms, 'imperial').map(describeRoomChoice)).toEqual([
      "Bathroom: Beadboard wainscot, wainscot, 4' high on Long wall 1, Short wall 1, Long wall 2, Short wall 2 (damp room)",
      "Living room: Beadboard wainscot, wainscot, 3' high on Long wall 1, Long wall 2; accent wall Short wall 1: Board and batten, full height",
    ]);
  });

  it('writes the wainscot height in millimetres for a metric firm', () => {
    // Source: docs/sources.md §13 — 48 in is 1219.2 mm, written to the nearest millimetre.
    expect(roomChoices(result.takeoff.rooms, 'metric')[0]!.height).toBe('wainscot, 1219 mm high');
  });

  it("says the same per-room choices in the homeowner's e-mail and the firm's alert, text and HTML alike", () => {
    const company = { name: 'Cedar Hollow Trim & Co.', phone: '+1 512 555 0147', notificationEmails: [] as string[] } as unknown as Company;
    const lead = {
      reference: 'L-2B9X',
      name: 'Rowan Pike',
      email: 'rowan@example.test',
      phone: '+1 512 555 0166',
      address: '27 Heron Row',
      postcode: '78704',
      preferredContact: 'phone',
      message: null,
    };
    const choices = roomChoices(result.takeoff.rooms, 'imperial');
    const view = presentForHomeowner(result);
    const mail = homeownerConfirmation(company, lead, view, 'https://lapwing.test/estimate/x?key=y', choices);
    const alert = newLeadAlert(company, lead, view, 'https://lapwing.test/app/leads/x', 0, choices);
    const accent = 'accent wall Short wall 1: Board and batten, full height';
    for (const text of [mail.text, mail.html, alert.text, alert.html]) expect(text).toContain(accent);
  });
});
