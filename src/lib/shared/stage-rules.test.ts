import { describe, expect, test } from 'vitest';
import { checkStageMove, skippedStages } from './stage-rules';
import { DEFAULT_LOST_REASONS } from './lead-flow-schemas';

// The stage rules are Lapwing's own product rules for Inquiries; no outside source defines them.
const reasons = DEFAULT_LOST_REASONS;

describe('stage moves', () => {
  test('one stage forward, or any number back, needs nothing more', () => {
    expect(checkStageMove({ from: 'new', to: 'spoken-to', reasons })).toEqual({ ok: true });
    expect(checkStageMove({ from: 'quote-sent', to: 'going-ahead', reasons })).toEqual({ ok: true });
    expect(checkStageMove({ from: 'going-ahead', to: 'new', reasons })).toEqual({ ok: true });
    expect(checkStageMove({ from: 'measured', to: 'spoken-to', reasons })).toEqual({ ok: true });
  });

  test('a forward skip is refused with 409 naming the skipped stages, unless confirmed', () => {
    expect(skippedStages('new', 'going-ahead')).toEqual(['spoken-to', 'visit-booked', 'measured', 'quote-sent']);
    const refused = checkStageMove({ from: 'new', to: 'going-ahead', reasons });
    expect(refused).toMatchObject({ ok: false, status: 409 });
    expect(refused.ok || refused.fields.to).toBe('This skips Spoken to, Visit booked, Measured, Quote sent. Confirm to move it anyway.');
    expect(checkStageMove({ from: 'new', to: 'going-ahead', confirm: true, reasons })).toEqual({ ok: true });
    expect(checkStageMove({ from: 'spoken-to', to: 'measured', confirm: false, reasons })).toMatchObject({ ok: false, status: 409 });
  });

  test('Not going ahead needs a reason from the firm’s list, and only it takes one', () => {
    expect(checkStageMove({ from: 'new', to: 'not-going-ahead', reasons })).toMatchObject({
      status: 400,
      fields: { reason: 'Choose why it is not going ahead.' },
    });
    expect(checkStageMove({ from: 'new', to: 'not-going-ahead', reason: 'Too windy', reasons })).toMatchObject({
      status: 400,
      fields: { reason: expect.any(String) },
    });
    expect(checkStageMove({ from: 'new', to: 'not-going-ahead', reason: 'Price', reasons })).toEqual({ ok: true });
    expect(checkStageMove({ from: 'new', to: 'spoken-to', reason: 'Price', reasons })).toMatchObject({ status: 400, fields: { reason: expect.any(String) } });
  });

  test('moving to the stage it is at is a 400; reopening from Not going ahead goes anywhere', () => {
    expect(checkStageMove({ from: 'measured', to: 'measured', reasons })).toMatchObject({ status: 400, fields: { to: 'It is already at Measured.' } });
    expect(checkStageMove({ from: 'not-going-ahead', to: 'going-ahead', reasons })).toEqual({ ok: true });
    expect(skippedStages('visit-booked', 'not-going-ahead')).toEqual([]);
  });
});
