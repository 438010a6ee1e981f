/**
 * Inquiries coming in and kept tidy, through the staff routes and the real database: phone
 * inquiries, who gets the new-inquiry e-mail, duplicates and merging, delete and restore. Each test
 * uses firms of its own (`buildFirm`), so files running side by side never share rows.
 */
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { APIRoute } from 'astro';
import type { MikroORM } from '@mikro-orm/postgresql';
import { estimate, sampleRateBook } from '../../src/lib/estimate';
import { projectSchema } from '../../src/lib/estimate/schemas';
import { getOrm } from '../../src/lib/server/boot/orm';
import { Lead } from '../../src/lib/server/leads/lead.entity';
import { LeadEvent } from '../../src/lib/server/leads/lead-event.entity';
import { leadOfCompany } from '../../src/lib/server/leads/lead.repository';
import { leadTimeline } from '../../src/lib/server/leads/lead-events';
import { OutboxMail } from '../../src/lib/server/mail/outbox-mail.entity';
import { LeadPhoto } from '../../src/lib/server/photos/lead-photo.entity';
import { NotFound } from '../../src/lib/server/errors';
import * as leadsRoute from '../../src/pages/api/app/leads/index';
import * as estimateRoute from '../../src/pages/api/app/leads/estimate';
import * as leadRoute from '../../src/pages/api/app/leads/[id]/index';
import * as restoreRoute from '../../src/pages/api/app/leads/[id]/restore';
import * as mergeRoute from '../../src/pages/api/app/leads/[id]/merge';
import * as notificationsRoute from '../../src/pages/api/app/me/notifications';
import { buildFirm } from '../helpers/accounts';
import { buildRateBookVersion } from '../helpers/factories';
import { callAsStaff, type StaffCaller } from '../helpers/staff-route';
import { renderStaffPage, textOf } from '../helpers/staff-pages';

let orm: MikroORM;
beforeAll(async () => {
  orm = await getOrm();
});
afterAll(async () => {
  await orm.close();
});
const em = () => orm.em.fork();

const DAY = 24 * 60 * 60 * 1000;

/** A room as a homeowner would describe it on the phone (invented). */
const PROJECT = {
  rooms: [
    {
      name: 'Dining room',
      ceilingHeight: 96,
      length: 156,
      width: 132,
      walls: [{ side: 'length' }, { side: 'width', openings: [{ kind: 'door' }] }],
      treatment: { id: 'beadboard', height: 'wainscot' },
    },
  ],
  builtBefore1978: 'no',
  measuredBy: 'homeowner-tape',
};

function contact(overrides: Record<string, unknown> = {}) {
  return {
    name: 'Bea Whitlow',
    email: `bea-${randomUUID().slice(0, 8)}@example.test`,
    phone: '(512) 555-0172',
    address: '9 Wren Ct',
    postcode: '78704',
    preferredContact: 'phone',
    consent: true,
    ...overrides,
  };
}

/** A firm with an owner and two salespeople and a published Rate book (the core's sample numbers). */
async function firmWithRates() {
  const firm = await buildFirm(em(), [
    { name: 'Ona', role: 'owner' },
    { name: 'Sid', role: 'sales' },
    { name: 'Tove', role: 'sales' },
  ]);
  const tx = em();
  buildRateBookVersion(tx, firm.company.id, { status: 'published' });
  await tx.flush();
  const as = (i: number): StaffCaller => ({ company: firm.company, user: firm.members[i]!.user, membership: firm.members[i]!.membership });
  return { ...firm, owner: as(0), sales: as(1), sales2: as(2) };
}

type Json = Record<string, any>;

async function call(handler: APIRoute, as: StaffCaller, method: string, path: string, params: Record<string, string> = {}, body?: unknown) {
  const response = await callAsStaff(handler, as, { em: em(), method, path, params, body });
  return { status: response.status, json: (await response.json().catch(() => null)) as Json };
}

/** Enters a phone inquiry through the route and returns its id. */
async function enter(as: StaffCaller, contactOverrides: Record<string, unknown> = {}): Promise<string> {
  const { status, json } = await call(
    leadsRoute.POST,
    as,
    'POST',
    '/api/app/leads',
    {},
    { idempotencyKey: randomUUID(), project: PROJECT, contact: contact(contactOverrides) },
  );
  expect(status).toBe(201);
  return json.lead.id;
}

describe('phone inquiries', () => {
  test('a salesperson enters one: priced as the widget would price it, "entered by staff", received by them', async () => {
    const firm = await firmWithRates();
    const key = randomUUID();
    const body = { idempotencyKey: key, project: PROJECT, contact: contact() };
    const { status, json } = await call(leadsRoute.POST, firm.sales, 'POST', '/api/app/leads', {}, body);
    expect(status).toBe(201);

    const lead = await em().findOneOrFail(Lead, { id: json.lead.id });
    expect(lead.source).toBe('staff');
    expect(lead.phone).toBe('+15125550172');
    // Source: the estimating core itself, run on the same project and Rate book: a phone inquiry
    // gets exactly the widget's numbers (no photos with it).
    const expected = estimate(projectSchema.parse({ ...PROJECT, photoCount: 0 }), sampleRateBook());
    expect([lead.rangeLowCents, lead.rangeHighCents]).toEqual([expected.price.lowCents, expected.price.highCents]);
    expect(json.estimate.range.text).toBe(expected.price.rangeText);

    const [received] = await leadTimeline(em(), firm.company.id, lead.id);
    expect(received).toMatchObject({ kind: 'received', data: { source: 'staff' } });
    expect(received!.actor?.id).toBe(firm.sales.user.id);

    // The same key again (a double click) answers the same inquiry and stores no second one.
    const again = await call(leadsRoute.POST, firm.sales, 'POST', '/api/app/leads', {}, body);
    expect(again.status).toBe(200);
    expect(again.json.lead.id).toBe(lead.id);
    expect(await em().count(Lead, { company: firm.company })).toBe(1);
  });

  test('the live range while typing is the widget’s estimate of the same rooms; bad rooms are refused by field', async () => {
    const firm = await firmWithRates();
    const { status, json } = await call(estimateRoute.POST, firm.sales, 'POST', '/api/app/leads/estimate', {}, { project: PROJECT });
    expect(status).toBe(200);
    // Source: the estimating core itself on the same project and Rate book.
    expect(json.estimate.range.text).toBe(estimate(projectSchema.parse({ ...PROJECT, photoCount: 0 }), sampleRateBook()).price.rangeText);
    const bad = await call(
      estimateRoute.POST,
      firm.sales,
      'POST',
      '/api/app/leads/estimate',
      {},
      { project: { ...PROJECT, rooms: [{ ...PROJECT.rooms[0], ceilingHeight: 2 }] } },
    );
    expect(bad.status).toBe(400);
    expect(bad.json.fields).toHaveProperty(['project.rooms.0.ceilingHeight']);
  });

  test('bad input is refused field by field, and nothing is stored', async () => {
    const firm = await firmWithRates();
    const { status, json } = await call(
      leadsRoute.POST,
      firm.sales,
      'POST',
      '/api/app/leads',
      {},
      { idempotencyKey: randomUUID(), project: { ...PROJECT, rooms: [] }, contact: contact({ consent: false, phone: '12', email: 'not an address' }) },
    );
    expect(status).toBe(400);
    expect(json.fields).toMatchObject({
      'project.rooms': 'Add at least one room.',
      'contact.consent': 'Confirm that the homeowner agreed to be contacted about this inquiry.',
      'contact.phone': expect.stringContaining('phone number'),
      'contact.email': expect.stringContaining('e-mail address'),
    });
    const wrongTreatment = await call(
      leadsRoute.POST,
      firm.sales,
      'POST',
      '/api/app/leads',
      {},
      {
        idempotencyKey: randomUUID(),
        project: { ...PROJECT, rooms: [{ ...PROJECT.rooms[0], treatment: { id: 'no-such-finish', height: 'full' } }] },
        contact: contact(),
      },
    );
    expect(wrongTreatment.status).toBe(400);
    expect(Object.keys(wrongTreatment.json.fields).every((path) => path.startsWith('project.rooms.0'))).toBe(true);
    expect(await em().count(Lead, { company: firm.company })).toBe(0);
  });
});

describe('who gets new-inquiry e-mails', () => {
  test('every owner and salesperson by default; someone who opts out on their account no longer does', async () => {
    const firm = await firmWithRates();
    const recipients = async (leadId: string) => {
      const lead = await em().findOneOrFail(Lead, { id: leadId });
      const mails = await em().find(OutboxMail, { company: firm.company, subject: { $like: `%${lead.reference}%` }, toAddress: { $ne: lead.email } });
      return mails.map((m) => m.toAddress).sort();
    };
    const everyone = firm.members.map((m) => m.email).sort();
    expect(await recipients(await enter(firm.owner))).toEqual(everyone);

    const off = await call(notificationsRoute.PATCH, firm.sales2, 'PATCH', '/api/app/me/notifications', {}, { newInquiryMail: false });
    expect(off).toEqual({ status: 200, json: { newInquiryMail: false } });
    expect(await recipients(await enter(firm.owner))).toEqual(everyone.filter((e) => e !== firm.members[2]!.email));

    // The team screen says who gets them.
    const team = textOf(await renderStaffPage('team', { em: em(), ...firm.owner }, '/app/setup/team'));
    expect(team).toContain('Every owner and salesperson gets an e-mail about each new inquiry');
    expect(team).toMatch(new RegExp(`${firm.members[1]!.email} Role of Sid .*? Save Yes`));
    expect(team).toMatch(new RegExp(`${firm.members[2]!.email} Role of Tove .*? Save No \\(turned off on their account page\\)`));

    const bad = await call(notificationsRoute.PATCH, firm.sales2, 'PATCH', '/api/app/me/notifications', {}, { newInquiryMail: 'yes' });
    expect(bad.status).toBe(400);
    expect(bad.json.fields).toHaveProperty('newInquiryMail');
  });
});

describe('duplicates', () => {
  test('the same e-mail (any case) or the same phone (any format) in the same firm is flagged; another firm’s never is', async () => {
    const firm = await firmWithRates();
    const other = await firmWithRates();
    const email = `dup-${randomUUID().slice(0, 8)}@example.test`;
    const first = await enter(firm.sales, { email, phone: '(512) 555-0180' });
    const byEmail = await enter(firm.sales, { email: email.toUpperCase(), phone: '(512) 555-0181' });
    const byPhone = await enter(firm.sales, { phone: '512.555.0180' });
    const unrelated = await enter(firm.sales, { phone: '(512) 555-0189' });
    const elsewhere = await enter(other.sales, { email, phone: '(512) 555-0180' });
    const duplicateOf = async (id: string) => (await em().findOneOrFail(Lead, { id })).duplicateOf?.id ?? null;
    expect(await duplicateOf(first)).toBeNull();
    expect(await duplicateOf(byEmail)).toBe(first);
    // The newest open match: the phone matches the first one only.
    expect(await duplicateOf(byPhone)).toBe(first);
    // The inquiry page says so, with a merge; the score shows with its reasons beside it.
    const firstReference = (await em().findOneOrFail(Lead, { id: first })).reference;
    const page = textOf(await renderStaffPage('lead', { em: em(), ...firm.sales }, `/app/leads/${byPhone}`, { id: byPhone }));
    expect(page).toContain(`Looks like the same homeowner as ${firstReference} (Bea Whitlow, same phone`);
    expect(page).toContain(`Merge into ${firstReference}`);
    expect(page).toMatch(/Triage score \d+ of 100/);
    expect(page).toContain("Homeowner's timeline: Not asked");
    expect(await duplicateOf(unrelated)).toBeNull();
    expect(await duplicateOf(elsewhere)).toBeNull();
  });

  test('an ended or deleted inquiry is not matched', async () => {
    const firm = await firmWithRates();
    const email = `ended-${randomUUID().slice(0, 8)}@example.test`;
    const ended = await enter(firm.sales, { email, phone: '(512) 555-0190' });
    await em().nativeUpdate(Lead, { id: ended }, { stage: 'not-going-ahead' });
    const deleted = await enter(firm.sales, { phone: '(512) 555-0191' });
    await em().nativeUpdate(Lead, { id: deleted }, { deletedAt: new Date() });
    const again = await enter(firm.sales, { email, phone: '(512) 555-0191' });
    expect((await em().findOneOrFail(Lead, { id: again })).duplicateOf).toBeNull();
  });
});

describe('merging', () => {
  test('the kept inquiry’s timeline shows both histories, photos move with it, and the merged one stays as a pointer', async () => {
    const firm = await firmWithRates();
    const email = `merge-${randomUUID().slice(0, 8)}@example.test`;
    const kept = await enter(firm.sales, { email });
    const away = await enter(firm.sales2, { email, phone: '(512) 555-0177' });
    const tx = em();
    const awayLead = await tx.findOneOrFail(Lead, { id: away });
    tx.create(LeadPhoto, {
      company: firm.company,
      draftId: randomUUID(),
      lead: awayLead,
      status: 'ready',
      uploadKey: `uploads/x/${randomUUID()}`,
      originalName: 'hall.jpg',
    });
    tx.create(LeadEvent, {
      company: firm.company,
      lead: awayLead,
      kind: 'note',
      actor: firm.sales2.user.id,
      at: new Date(),
      data: { text: 'Wants it before spring', mentions: [] },
    });
    await tx.flush();

    const { status, json } = await call(mergeRoute.POST, firm.sales, 'POST', `/api/app/leads/${away}/merge`, { id: away }, { into: kept });
    expect(status).toBe(200);
    expect(json.url).toBe(`/app/leads/${kept}`);

    const keptReference = (await em().findOneOrFail(Lead, { id: kept })).reference;
    const timeline = await leadTimeline(em(), firm.company.id, kept);
    expect(timeline.map((e) => e.kind)).toEqual(['received', 'received', 'note', 'merged']);
    expect(timeline.at(-1)!.data).toEqual({ other: away, otherReference: awayLead.reference, kept: true });
    expect(await em().count(LeadPhoto, { lead: kept })).toBe(1);

    const merged = await em().findOneOrFail(Lead, { id: away }, { populate: ['mergedInto'] });
    expect(merged.mergedInto?.id).toBe(kept);
    expect(merged.deletedAt).not.toBeNull();
    const left = await leadTimeline(em(), firm.company.id, away);
    expect(left.map((e) => [e.kind, e.data])).toEqual([['merged', { other: kept, otherReference: keptReference, kept: false }]]);
    // It leaves every list and lookup, and cannot be merged again.
    await expect(leadOfCompany(em(), firm.company.id, away)).rejects.toBeInstanceOf(NotFound);
    expect((await call(mergeRoute.POST, firm.sales, 'POST', `/api/app/leads/${away}/merge`, { id: away }, { into: kept })).status).toBe(404);
  });

  test('bad input, itself, and another firm’s inquiries are refused; nothing moves', async () => {
    const firm = await firmWithRates();
    const other = await firmWithRates();
    const mine = await enter(firm.sales);
    const theirs = await enter(other.sales);
    const merge = (as: StaffCaller, id: string, body: unknown) => call(mergeRoute.POST, as, 'POST', `/api/app/leads/${id}/merge`, { id }, body);

    const self = await merge(firm.sales, mine, { into: mine });
    expect(self).toMatchObject({ status: 400, json: { fields: { into: 'Choose another inquiry.' } } });
    const malformed = await merge(firm.sales, mine, { into: 'not-an-id' });
    expect(malformed.status).toBe(400);
    expect(malformed.json.fields).toHaveProperty('into');
    expect((await merge(firm.sales, mine, {})).json.fields).toHaveProperty('into');
    // Another firm's inquiry, in the body or in the address: not found.
    expect((await merge(firm.sales, mine, { into: theirs })).status).toBe(404);
    expect((await merge(firm.sales, theirs, { into: mine })).status).toBe(404);
    expect((await em().findOneOrFail(Lead, { id: mine })).mergedInto).toBeNull();
    expect((await em().findOneOrFail(Lead, { id: theirs })).mergedInto).toBeNull();
  });
});

describe('delete and restore', () => {
  test('owners only: a salesperson gets 403, the owner deletes (gone from lookups) and restores it, each on the timeline', async () => {
    const firm = await firmWithRates();
    const id = await enter(firm.sales);
    expect((await call(leadRoute.DELETE, firm.sales, 'DELETE', `/api/app/leads/${id}`, { id })).status).toBe(403);
    const deleted = await call(leadRoute.DELETE, firm.owner, 'DELETE', `/api/app/leads/${id}`, { id });
    expect(deleted.status).toBe(200);
    // Source: the rule "restorable for 30 days".
    expect(new Date(deleted.json.purgeAt).getTime() - new Date(deleted.json.deletedAt).getTime()).toBe(30 * DAY);
    await expect(leadOfCompany(em(), firm.company.id, id)).rejects.toBeInstanceOf(NotFound);
    expect((await call(leadRoute.DELETE, firm.owner, 'DELETE', `/api/app/leads/${id}`, { id })).status).toBe(404);

    expect((await call(restoreRoute.POST, firm.sales, 'POST', `/api/app/leads/${id}/restore`, { id })).status).toBe(403);
    expect((await call(restoreRoute.POST, firm.owner, 'POST', `/api/app/leads/${id}/restore`, { id })).status).toBe(200);
    expect((await leadOfCompany(em(), firm.company.id, id)).deletedAt).toBeNull();
    expect((await leadTimeline(em(), firm.company.id, id)).map((e) => `${e.kind}:${e.actor?.id === firm.owner.user.id}`)).toEqual([
      'received:false',
      'deleted:true',
      'restored:true',
    ]);
    // Not deleted any more: nothing to restore.
    expect((await call(restoreRoute.POST, firm.owner, 'POST', `/api/app/leads/${id}/restore`, { id })).status).toBe(409);
  });

  test('another firm’s ids are not found; past 30 days a deletion can no longer be undone', async () => {
    const firm = await firmWithRates();
    const other = await firmWithRates();
    const id = await enter(firm.sales);
    expect((await call(leadRoute.DELETE, other.owner, 'DELETE', `/api/app/leads/${id}`, { id })).status).toBe(404);
    expect((await call(leadRoute.DELETE, other.owner, 'DELETE', '/api/app/leads/not-an-id', { id: 'not-an-id' })).status).toBe(404);
    await em().nativeUpdate(Lead, { id }, { deletedAt: new Date(Date.now() - 30 * DAY - 60_000) });
    expect((await call(restoreRoute.POST, other.owner, 'POST', `/api/app/leads/${id}/restore`, { id })).status).toBe(404);
    const late = await call(restoreRoute.POST, firm.owner, 'POST', `/api/app/leads/${id}/restore`, { id });
    expect(late.status).toBe(409);
    expect(late.json.error).toContain('30 days');
  });
});
