import { afterAll, afterEach, beforeAll, describe, expect, test } from 'vitest';
import type { APIContext, APIRoute } from 'astro';
import type { MikroORM } from '@mikro-orm/postgresql';
import { getOrm } from '../../src/lib/server/boot/orm';
import { now } from '../../src/lib/server/clock';
import type { Company } from '../../src/lib/server/companies/company.entity';
import type { Membership } from '../../src/lib/server/users/membership.entity';
import type { User } from '../../src/lib/server/users/user.entity';
import { Lead } from '../../src/lib/server/leads/lead.entity';
import { LeadEvent } from '../../src/lib/server/leads/lead-event.entity';
import { FollowUpReminder } from '../../src/lib/server/leads/follow-up-reminder.entity';
import { followUpRemindersJob, sendDueFollowUpReminders } from '../../src/lib/server/leads/follow-up-reminders';
import { recordLeadEvent } from '../../src/lib/server/leads/lead-events';
import { OutboxMail } from '../../src/lib/server/mail/outbox-mail.entity';
import type { TimelineView } from '../../src/lib/shared/inquiry-timeline';
import { DEFAULT_LOST_REASONS } from '../../src/lib/shared/lead-flow-schemas';
import * as stageRoute from '../../src/pages/api/app/leads/[id]/stage';
import * as assigneeRoute from '../../src/pages/api/app/leads/[id]/assignee';
import * as followUpRoute from '../../src/pages/api/app/leads/[id]/follow-up';
import * as timelineRoute from '../../src/pages/api/app/leads/[id]/timeline';
import * as undoRoute from '../../src/pages/api/app/leads/[id]/events/[eventId]/undo';
import * as lostReasonsRoute from '../../src/pages/api/app/settings/lost-reasons';
import { buildFirm } from '../helpers/accounts';
import { buildLead } from '../helpers/factories';
import { useFakeClock, DAY_MS, HOUR_MS, MINUTE_MS } from '../helpers/fake-clock';
import { renderStaffPage, textOf } from '../helpers/staff-pages';

// The stage rules, undo rules and who may do what are Lapwing's own product rules; no outside
// source defines them. Time-zone facts carry their source where they are checked.

let orm: MikroORM;
beforeAll(async () => {
  orm = await getOrm();
});
afterAll(async () => {
  await orm.close();
});
const em = () => orm.em.fork();

type Person = { user: User; membership: Membership };

/** Calls a staff route in-process as a signed-in member of a firm, with a real Request. */
async function call(route: APIRoute, as: { company: Company; person: Person }, method: string, path: string, params: Record<string, string>, body?: unknown) {
  const url = new URL(path, 'http://127.0.0.1:4321');
  const request = new Request(url, {
    method,
    headers: { 'content-type': 'application/json' },
    body: body === undefined ? undefined : typeof body === 'string' ? body : JSON.stringify(body),
  });
  const membership = {
    id: as.person.membership.id,
    companyId: as.company.id,
    companyName: as.company.name,
    companySlug: as.company.slug,
    role: as.person.membership.role,
  };
  const locals = {
    em: em(),
    user: { id: as.person.user.id, email: as.person.user.email, name: as.person.user.name },
    session: { token: 'test-session', expiresAt: new Date(Date.now() + HOUR_MS), absoluteExpiresAt: new Date(Date.now() + HOUR_MS) },
    membership,
    memberships: [membership],
  };
  const response = await route({ request, url, params, locals, clientAddress: '192.0.2.10' } as unknown as APIContext);
  return { status: response.status, body: await response.json() };
}

/** A firm of three (an owner and two salespeople) in Chicago time, and a second firm of one. */
async function twoFirms() {
  const first = await buildFirm(
    em(),
    [
      { name: 'Opal', role: 'owner' },
      { name: 'Sid', role: 'sales' },
      { name: 'Ruth', role: 'sales' },
    ],
    { timeZone: 'America/Chicago' },
  );
  const second = await buildFirm(em(), [{ name: 'Ned', role: 'owner' }]);
  const fork = em();
  const lead = buildLead(fork, first.company.id, { name: 'Hollis Pike' });
  recordLeadEvent(fork, lead, 'received', { data: { source: 'widget' }, at: new Date(now().getTime() - HOUR_MS) });
  await fork.flush();
  const [owner, sales, teammate] = first.members;
  return {
    lead,
    owner: { company: first.company, person: owner! },
    sales: { company: first.company, person: sales! },
    teammate: teammate!,
    other: { company: second.company, person: second.members[0]! },
    otherMembership: second.members[0]!.membership,
  };
}

const stage = (as: Parameters<typeof call>[1], leadId: string, body: unknown) =>
  call(stageRoute.POST, as, 'POST', `/api/app/leads/${leadId}/stage`, { id: leadId }, body);
const assign = (as: Parameters<typeof call>[1], leadId: string, body: unknown) =>
  call(assigneeRoute.PUT, as, 'PUT', `/api/app/leads/${leadId}/assignee`, { id: leadId }, body);
const followUp = (as: Parameters<typeof call>[1], leadId: string, body: unknown) =>
  call(followUpRoute.PUT, as, 'PUT', `/api/app/leads/${leadId}/follow-up`, { id: leadId }, body);
const undo = (as: Parameters<typeof call>[1], leadId: string, eventId: string) =>
  call(undoRoute.POST, as, 'POST', `/api/app/leads/${leadId}/events/${eventId}/undo`, { id: leadId, eventId });
const timeline = (as: Parameters<typeof call>[1], leadId: string) => call(timelineRoute.GET, as, 'GET', `/api/app/leads/${leadId}/timeline`, { id: leadId });

const lastEvent = (view: TimelineView) => view.events.at(-1)!;

let restoreClock: (() => void) | null = null;
afterEach(() => {
  restoreClock?.();
  restoreClock = null;
});

describe('stage moves', () => {
  test('a move is recorded with who, when, from and to, in the same answer as the new stage', async () => {
    const { lead, sales } = await twoFirms();
    const moved = await stage(sales, lead.id, { to: 'spoken-to' });
    expect(moved.status).toBe(200);
    expect(moved.body.state.stage).toBe('spoken-to');
    const event = await em().findOneOrFail(LeadEvent, { lead: lead.id, kind: 'stage-moved' }, { populate: ['actor'] });
    expect(event.data).toEqual({ from: 'new', to: 'spoken-to' });
    expect(event.actor?.id).toBe(sales.person.user.id);
    expect(lastEvent(moved.body)).toMatchObject({ kind: 'stage-moved', who: 'Sid', text: 'New inquiry → Spoken to', undoable: true });
  });

  test('a forward skip is refused with 409 and a field message until confirmed', async () => {
    const { lead, sales } = await twoFirms();
    const refused = await stage(sales, lead.id, { to: 'going-ahead' });
    expect(refused).toMatchObject({ status: 409, body: { fields: { to: expect.stringContaining('skips Spoken to, Visit booked, Measured, Quote sent') } } });
    expect((await em().findOneOrFail(Lead, lead.id)).stage).toBe('new');
    const confirmed = await stage(sales, lead.id, { to: 'going-ahead', confirm: true });
    expect(confirmed.status).toBe(200);
    expect(confirmed.body.state.stage).toBe('going-ahead');
  });

  test('Not going ahead needs a reason from the firm’s list, kept on the inquiry; moving on clears it', async () => {
    const { lead, sales } = await twoFirms();
    expect(await stage(sales, lead.id, { to: 'not-going-ahead' })).toMatchObject({ status: 400, body: { fields: { reason: expect.any(String) } } });
    expect(await stage(sales, lead.id, { to: 'not-going-ahead', reason: 'The moon was wrong' })).toMatchObject({
      status: 400,
      body: { fields: { reason: expect.any(String) } },
    });
    const lost = await stage(sales, lead.id, { to: 'not-going-ahead', reason: 'Timing' });
    expect(lost.body.state).toMatchObject({ stage: 'not-going-ahead', lostReason: 'Timing' });
    expect((await em().findOneOrFail(Lead, lead.id)).lostReason).toBe('Timing');
    const reopened = await stage(sales, lead.id, { to: 'spoken-to' });
    expect(reopened.body.state).toMatchObject({ stage: 'spoken-to', lostReason: null });
  });

  test('bad input gets field-level 400s: an unknown stage, the same stage, an unknown key, a reason on another stage', async () => {
    const { lead, sales } = await twoFirms();
    expect(await stage(sales, lead.id, { to: 'finished' })).toMatchObject({
      status: 400,
      body: { error: expect.any(String), fields: { to: 'Choose a stage.' } },
    });
    expect(await stage(sales, lead.id, { to: 'new' })).toMatchObject({ status: 400, body: { fields: { to: 'It is already at New inquiry.' } } });
    expect(await stage(sales, lead.id, { to: 'spoken-to', colour: 'red' })).toMatchObject({ status: 400 });
    expect(await stage(sales, lead.id, { to: 'spoken-to', reason: 'Price' })).toMatchObject({ status: 400, body: { fields: { reason: expect.any(String) } } });
    expect(await stage(sales, lead.id, '{"to":')).toMatchObject({ status: 400 });
    expect(await em().count(LeadEvent, { lead: lead.id, kind: 'stage-moved' })).toBe(0);
  });

  test('another firm’s inquiry, a malformed id and a deleted inquiry are not found, whatever the body', async () => {
    const { lead, other, sales } = await twoFirms();
    expect(await stage(other, lead.id, { to: 'spoken-to' })).toMatchObject({ status: 404 });
    expect(await stage(other, lead.id, { to: 'nonsense' })).toMatchObject({ status: 404 });
    expect(await stage(sales, 'not-an-id', { to: 'spoken-to' })).toMatchObject({ status: 404 });
    await em().nativeUpdate(Lead, { id: lead.id }, { deletedAt: new Date() });
    expect(await stage(sales, lead.id, { to: 'spoken-to' })).toMatchObject({ status: 404 });
    expect((await em().findOneOrFail(Lead, lead.id)).stage).toBe('new');
  });
});

describe('undo from the history', () => {
  test('undoes the latest stage move step by step, marking each entry and recording nothing new', async () => {
    const clock = useFakeClock('2026-12-03T15:00:00Z');
    restoreClock = clock.restore;
    const { lead, sales, owner } = await twoFirms();
    await stage(sales, lead.id, { to: 'spoken-to' });
    clock.advance(MINUTE_MS);
    const skipped = await stage(sales, lead.id, { to: 'quote-sent', confirm: true });
    const [first, second] = skipped.body.events.filter((e: { kind: string }) => e.kind === 'stage-moved');
    expect(first.undoable).toBe(false);
    expect(second.undoable).toBe(true);

    expect(await undo(owner, lead.id, first.id)).toMatchObject({ status: 409, body: { error: 'Only the latest stage move can be undone.' } });
    const undone = await undo(owner, lead.id, second.id);
    expect(undone.status).toBe(200);
    expect(undone.body.state.stage).toBe('spoken-to');
    expect(undone.body.events).toHaveLength(skipped.body.events.length);
    expect(undone.body.events.find((e: { id: string }) => e.id === second.id)).toMatchObject({ undoable: false, undone: { who: 'Opal' } });
    const row = await em().findOneOrFail(LeadEvent, second.id);
    expect(row.undoneAt?.toISOString()).toBe('2026-12-03T15:01:00.000Z');
    expect(row.undoneBy?.id).toBe(owner.person.user.id);
    expect(await undo(owner, lead.id, second.id)).toMatchObject({ status: 409, body: { error: 'This was already undone.' } });

    // The earlier move is now the latest in force: it can be undone too.
    expect((await undo(sales, lead.id, first.id)).body.state.stage).toBe('new');
  });

  test('undoing a move to and from Not going ahead restores the reason as it was', async () => {
    const clock = useFakeClock('2026-12-03T15:00:00Z');
    restoreClock = clock.restore;
    const { lead, sales } = await twoFirms();
    await stage(sales, lead.id, { to: 'not-going-ahead', reason: 'Price' });
    clock.advance(MINUTE_MS);
    const reopened = await stage(sales, lead.id, { to: 'measured' });
    const back = await undo(sales, lead.id, lastEvent(reopened.body).id);
    expect(back.body.state).toMatchObject({ stage: 'not-going-ahead', lostReason: 'Price' });
    const moves = back.body.events.filter((e: { kind: string; undone: unknown }) => e.kind === 'stage-moved' && !e.undone);
    const start = await undo(sales, lead.id, moves.at(-1).id);
    expect(start.body.state).toMatchObject({ stage: 'new', lostReason: null });
  });

  test('undoes the latest assignment; other entries, other leads’ entries and other firms are refused', async () => {
    const clock = useFakeClock('2026-12-03T15:00:00Z');
    restoreClock = clock.restore;
    const { lead, sales, teammate, other } = await twoFirms();
    await assign(sales, lead.id, { membershipId: sales.person.membership.id });
    clock.advance(MINUTE_MS);
    const given = await assign(sales, lead.id, { membershipId: teammate.membership.id });
    const back = await undo(sales, lead.id, lastEvent(given.body).id);
    expect(back.body.state.assigneeId).toBe(sales.person.membership.id);

    const received = back.body.events.find((e: { kind: string }) => e.kind === 'received');
    expect(await undo(sales, lead.id, received.id)).toMatchObject({ status: 409, body: { error: 'Only stage moves and assignments can be undone.' } });
    expect(await undo(other, lead.id, lastEvent(given.body).id)).toMatchObject({ status: 404 });
    const fork = em();
    const otherLead = buildLead(fork, sales.company.id);
    await fork.flush();
    expect(await undo(sales, otherLead.id, lastEvent(given.body).id)).toMatchObject({ status: 404 });
    expect(await undo(sales, lead.id, 'not-an-id')).toMatchObject({ status: 404 });
  });
});

describe('assignment', () => {
  test('gives the inquiry to a teammate and records who had it and who has it now', async () => {
    const { lead, sales, teammate } = await twoFirms();
    const given = await assign(sales, lead.id, { membershipId: teammate.membership.id });
    expect(given.status).toBe(200);
    expect(given.body.state.assigneeId).toBe(teammate.membership.id);
    expect(lastEvent(given.body)).toMatchObject({ kind: 'assigned', text: 'Assigned to Ruth', who: 'Sid' });
    const event = await em().findOneOrFail(LeadEvent, lastEvent(given.body).id);
    expect(event.data).toEqual({ from: null, to: teammate.membership.id, toName: 'Ruth' });
    const cleared = await assign(sales, lead.id, { membershipId: null });
    expect(lastEvent(cleared.body)).toMatchObject({ text: 'Unassigned' });
  });

  test('someone outside the firm, a malformed id, the same assignee or a missing field is a field error', async () => {
    const { lead, sales, otherMembership, other } = await twoFirms();
    expect(await assign(sales, lead.id, { membershipId: otherMembership.id })).toMatchObject({
      status: 400,
      body: { fields: { membershipId: 'Choose someone on your team.' } },
    });
    expect(await assign(sales, lead.id, { membershipId: 'sid' })).toMatchObject({
      status: 400,
      body: { fields: { membershipId: 'Choose someone on your team.' } },
    });
    expect(await assign(sales, lead.id, {})).toMatchObject({ status: 400, body: { fields: { membershipId: expect.any(String) } } });
    expect(await assign(sales, lead.id, { membershipId: null })).toMatchObject({
      status: 400,
      body: { fields: { membershipId: 'It is not assigned to anyone.' } },
    });
    expect(await assign(other, lead.id, { membershipId: otherMembership.id })).toMatchObject({ status: 404 });
    expect((await em().findOneOrFail(Lead, lead.id)).assignee).toBeNull();
  });
});

describe('follow-up and its reminder', () => {
  test('a time typed on the firm’s clock is stored as that moment; the past and bad shapes are refused', async () => {
    const clock = useFakeClock('2026-12-03T15:00:00Z');
    restoreClock = clock.restore;
    const { lead, sales, other } = await twoFirms();
    // Source: US Central Time is UTC−6 in December (CST); from memory.
    const set = await followUp(sales, lead.id, { at: '2026-12-04T09:30' });
    expect(set.status).toBe(200);
    expect(set.body.state).toMatchObject({
      nextFollowUpAt: '2026-12-04T15:30:00.000Z',
      nextFollowUpInput: '2026-12-04T09:30',
      nextFollowUpText: 'Dec 4, 2026, 9:30 AM',
    });
    expect(lastEvent(set.body)).toMatchObject({ kind: 'follow-up-set', text: 'Follow up on Dec 4, 2026, 9:30 AM' });

    expect(await followUp(sales, lead.id, { at: '2026-12-03T08:00' })).toMatchObject({ status: 400, body: { fields: { at: 'Choose a time in the future.' } } });
    expect(await followUp(sales, lead.id, { at: 'next tuesday' })).toMatchObject({ status: 400, body: { fields: { at: 'Choose a date and time.' } } });
    expect(await followUp(sales, lead.id, { at: '2031-01-01T09:00' })).toMatchObject({
      status: 400,
      body: { fields: { at: expect.stringContaining('two years') } },
    });
    expect(await followUp(sales, lead.id, {})).toMatchObject({ status: 400, body: { fields: { at: expect.any(String) } } });
    expect(await followUp(other, lead.id, { at: '2026-12-04T09:30' })).toMatchObject({ status: 404 });

    const cleared = await followUp(sales, lead.id, { at: null });
    expect(cleared.body.state.nextFollowUpAt).toBeNull();
    expect(await em().count(FollowUpReminder, { lead: lead.id, sentAt: null })).toBe(0);
  });

  test('the reminder goes once to the assignee when it comes due; a replaced follow-up sends nothing', async () => {
    const clock = useFakeClock('2026-12-03T15:00:00Z');
    restoreClock = clock.restore;
    const { lead, sales, teammate } = await twoFirms();
    await assign(sales, lead.id, { membershipId: teammate.membership.id });
    await followUp(sales, lead.id, { at: '2026-12-03T10:00' });
    // Replaced before it came due: only the later one is owed.
    await followUp(sales, lead.id, { at: '2026-12-03T11:00' });
    const teammateEmail = teammate.user.email;

    expect(await sendDueFollowUpReminders(em(), { now: new Date('2026-12-03T16:30:00Z') })).toMatchObject({ queued: 0 });
    clock.set('2026-12-03T17:00:30Z');
    await followUpRemindersJob.run({}, { em: em(), send: async () => null } as never);
    await followUpRemindersJob.run({}, { em: em(), send: async () => null } as never);
    const mails = await em().find(OutboxMail, { toAddress: teammateEmail });
    expect(mails).toHaveLength(1);
    expect(mails[0]!.subject).toBe(`Follow up today: Hollis Pike (${lead.reference})`);
    expect(mails[0]!.textBody).toContain(`/app/leads/${lead.id}`);
    // Source: US Central Time is UTC−6 in December (CST); from memory.
    expect(mails[0]!.textBody).toContain('Thu, Dec 3, 2026, 11:00 AM CST');
    expect(mails[0]!.company?.id).toBe(sales.company.id);
  });

  test('an unassigned inquiry’s reminder goes to whoever set the follow-up; a deleted one’s to nobody', async () => {
    const clock = useFakeClock('2026-12-03T15:00:00Z');
    restoreClock = clock.restore;
    const a = await twoFirms();
    const b = await twoFirms();
    await followUp(a.sales, a.lead.id, { at: '2026-12-03T10:00' });
    await followUp(b.sales, b.lead.id, { at: '2026-12-03T10:00' });
    await em().nativeUpdate(Lead, { id: b.lead.id }, { deletedAt: new Date() });
    await sendDueFollowUpReminders(em(), { now: new Date(Date.parse('2026-12-03T16:00:00Z') + DAY_MS) });
    expect(await em().count(OutboxMail, { toAddress: a.sales.person.user.email })).toBe(1);
    expect(await em().count(OutboxMail, { toAddress: b.sales.person.user.email })).toBe(0);
    expect(await em().count(FollowUpReminder, { lead: b.lead.id, sentAt: null })).toBe(0);
  });
});

describe('the timeline route', () => {
  test('lists every entry oldest first with who and when in the firm’s zone; another firm gets 404', async () => {
    const clock = useFakeClock('2026-12-03T15:00:00Z');
    restoreClock = clock.restore;
    const { lead, sales, other } = await twoFirms();
    await stage(sales, lead.id, { to: 'spoken-to' });
    const answer = await timeline(sales, lead.id);
    expect(answer.status).toBe(200);
    expect(answer.body.events.map((e: { kind: string }) => e.kind)).toEqual(['received', 'stage-moved']);
    // Source: US Central Time is UTC−6 in December (CST); from memory.
    expect(answer.body.events[1]).toMatchObject({ who: 'Sid', when: 'Dec 3, 2026, 9:00 AM', at: '2026-12-03T09:00:00-06:00' });
    expect(answer.body.events[0]).toMatchObject({ who: 'The homeowner', text: 'Sent through the price widget' });
    expect(await timeline(other, lead.id)).toMatchObject({ status: 404 });
  });
});

describe('the firm’s reasons for not going ahead', () => {
  test('start as the defaults; the owner replaces them, sales may only read them, the stage move uses them', async () => {
    const { lead, sales, owner, other } = await twoFirms();
    const read = (as: Parameters<typeof call>[1]) => call(lostReasonsRoute.GET, as, 'GET', '/api/app/settings/lost-reasons', {});
    const write = (as: Parameters<typeof call>[1], body: unknown) => call(lostReasonsRoute.PUT, as, 'PUT', '/api/app/settings/lost-reasons', {}, body);
    expect((await read(sales)).body.reasons).toEqual([...DEFAULT_LOST_REASONS]);
    expect(await write(sales, { reasons: ['Price'] })).toMatchObject({ status: 404 });
    expect(await write(owner, { reasons: ['Price', ' price '] })).toMatchObject({
      status: 400,
      body: { fields: { 'reasons.1': 'This reason is already on the list.' } },
    });
    expect(await write(owner, { reasons: ['Price', ''] })).toMatchObject({ status: 400, body: { fields: { 'reasons.1': expect.any(String) } } });
    expect(await write(owner, { reasons: [] })).toMatchObject({ status: 400, body: { fields: { reasons: 'Keep at least one reason.' } } });
    expect(await write(owner, { reasons: ['Budget', 'Went quiet'] })).toMatchObject({ status: 200, body: { reasons: ['Budget', 'Went quiet'] } });
    expect(await write(owner, { reasons: ['Budget', 'Went quiet', 'Moved house'] })).toMatchObject({ status: 200 });
    expect((await read(sales)).body.reasons).toEqual(['Budget', 'Went quiet', 'Moved house']);
    expect((await read(other)).body.reasons).toEqual([...DEFAULT_LOST_REASONS]);
    expect(await stage(sales, lead.id, { to: 'not-going-ahead', reason: 'Price' })).toMatchObject({
      status: 400,
      body: { fields: { reason: expect.any(String) } },
    });
    expect(await stage(sales, lead.id, { to: 'not-going-ahead', reason: 'Moved house' })).toMatchObject({ status: 200 });
  });
});

describe('the inquiry page', () => {
  test('is titled by its reference, with click-to-call, text and e-mail links and the phone written the firm’s way', async () => {
    const { lead, sales } = await twoFirms();
    const html = await renderStaffPage(
      'lead',
      { em: em(), company: sales.company, user: sales.person.user, membership: sales.person.membership },
      `/app/leads/${lead.id}`,
      {
        id: lead.id,
      },
    );
    expect(html).toContain(`<title>Inquiry ${lead.reference}`);
    expect(html).toContain('href="tel:+15125550147"');
    expect(html).toContain('href="sms:+15125550147"');
    expect(html).toContain(`href="mailto:${lead.email}"`);
    // Source: North American Numbering Plan, national format (NPA) NXX-XXXX; from memory.
    expect(textOf(html)).toContain('(512) 555-0147');
    expect(textOf(html)).toContain('Oldest first');
  });
});
