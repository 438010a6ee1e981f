/**
 * Working one inquiry through the staff routes, against the real database and the SMTP stand-in:
 * notes with @mentions, the call log, e-mail from the firm's templates with a private estimate
 * link, the photo links, the firm's templates, and the homeowner's views of their estimate.
 */
import { afterAll, afterEach, beforeAll, describe, expect, test } from 'vitest';
import type { MikroORM } from '@mikro-orm/postgresql';
import type { APIRoute } from 'astro';
import { getOrm } from '../../src/lib/server/boot/orm';
import { Lead } from '../../src/lib/server/leads/lead.entity';
import { LeadEvent } from '../../src/lib/server/leads/lead-event.entity';
import { LeadPhoto } from '../../src/lib/server/photos/lead-photo.entity';
import { MailTemplate } from '../../src/lib/server/leads/mail-template.entity';
import { OutboxMail } from '../../src/lib/server/mail/outbox-mail.entity';
import { leadForViewKey } from '../../src/lib/server/leads/lead.service';
import { newViewKey, viewKeyDigest } from '../../src/lib/server/leads/lead-view-keys';
import { recordHomeownerView } from '../../src/lib/server/leads/homeowner-views';
import { KEPT_LINK_TEXT } from '../../src/lib/server/leads/lead-emails';
import { NotFound } from '../../src/lib/server/errors';
import * as notesRoute from '../../src/pages/api/app/leads/[id]/notes';
import * as callsRoute from '../../src/pages/api/app/leads/[id]/calls';
import * as emailsRoute from '../../src/pages/api/app/leads/[id]/emails';
import * as photosRoute from '../../src/pages/api/app/leads/[id]/photos';
import * as templatesRoute from '../../src/pages/api/app/mail-templates/index';
import * as templateRoute from '../../src/pages/api/app/mail-templates/[id]';
import { buildFirm } from '../helpers/accounts';
import { buildLead } from '../helpers/factories';
import { callAsStaff, type StaffCaller } from '../helpers/as-staff';
import { deliverMailTo } from '../helpers/outbox';
import { waitForMail } from '../helpers/mailbox';
import { HOUR_MS, MINUTE_MS, useFakeClock } from '../helpers/fake-clock';

let orm: MikroORM;
const em = () => orm.em.fork();

type Firm = Awaited<ReturnType<typeof buildFirm>>;
let firm: Firm;
let otherFirm: Firm;
let owner: StaffCaller;
let sales: StaffCaller;
let teammate: StaffCaller;
let stranger: StaffCaller;
const caller = (f: Firm, i: number): StaffCaller => ({ company: f.company, user: f.members[i]!.user, membership: f.members[i]!.membership });

beforeAll(async () => {
  orm = await getOrm();
  firm = await buildFirm(em(), [
    { name: 'Olwen', role: 'owner' },
    { name: 'Saoirse', role: 'sales' },
    { name: 'Teodor', role: 'sales' },
  ]);
  otherFirm = await buildFirm(em(), [{ name: 'Nadia', role: 'owner' }]);
  owner = caller(firm, 0);
  sales = caller(firm, 1);
  teammate = caller(firm, 2);
  stranger = caller(otherFirm, 0);
});
afterAll(async () => {
  await orm.close();
});

/** A fresh lead of the first firm, with a known first key to the homeowner's link. */
async function aLead(): Promise<{ lead: Lead; firstKey: string }> {
  const setup = em();
  const lead = buildLead(setup, firm.company.id);
  const firstKey = newViewKey();
  lead.viewTokenHash = viewKeyDigest(firstKey);
  await setup.flush();
  return { lead, firstKey };
}

const call = (route: APIRoute, as: StaffCaller | null, method: string, path: string, params: Record<string, string>, body?: unknown) =>
  callAsStaff(route, as, { em: em(), method, path, params, body });

const post = (route: { POST: APIRoute }, as: StaffCaller | null, leadId: string, what: string, body: unknown) =>
  call(route.POST, as, 'POST', `/api/app/leads/${leadId}/${what}`, { id: leadId }, body);

const eventsOf = (leadId: string, kind: string) => em().find(LeadEvent, { lead: leadId, kind: kind as LeadEvent['kind'] }, { orderBy: { at: 'asc' } });

describe('notes', () => {
  test('bad input answers field-level 400s; signed out 401; another firm’s or a malformed id 404', async () => {
    const { lead } = await aLead();
    const empty = await post(notesRoute, sales, lead.id, 'notes', { text: '   ' });
    expect(empty.status).toBe(400);
    expect((await empty.json()).fields).toEqual({ text: 'Note is required.' });
    const long = await post(notesRoute, sales, lead.id, 'notes', { text: 'x'.repeat(4001) });
    expect((await long.json()).fields.text).toMatch(/at most 4000/);
    const extra = await post(notesRoute, sales, lead.id, 'notes', { text: 'ok', colour: 'red' });
    expect(extra.status).toBe(400);
    expect((await post(notesRoute, null, lead.id, 'notes', { text: 'hi' })).status).toBe(401);
    const foreign = await post(notesRoute, stranger, lead.id, 'notes', { text: 'hi' });
    expect(foreign.status).toBe(404);
    expect(await foreign.json()).toHaveProperty('error');
    expect((await post(notesRoute, sales, 'not-an-id', 'notes', { text: 'hi' })).status).toBe(404);
    expect(await eventsOf(lead.id, 'note')).toHaveLength(0);
  });

  test('a mention e-mails that teammate with a link to the inquiry; the writer and people outside the firm get nothing', async () => {
    const { lead } = await aLead();
    const text = `@${teammate.user.name} can you call back? Also @${stranger.user.name} and me, @${sales.user.name}.`;
    const response = await post(notesRoute, sales, lead.id, 'notes', { text });
    expect(response.status).toBe(201);
    expect((await response.json()).mailed).toBe(1);

    const [note] = await eventsOf(lead.id, 'note');
    expect(note!.data).toEqual({
      text,
      mentions: [
        { userId: teammate.user.id, name: teammate.user.name },
        { userId: sales.user.id, name: sales.user.name },
      ],
    });
    expect(note!.actor?.id).toBe(sales.user.id);
    // Nothing was queued for the other firm's owner, nor for the writer.
    expect(await em().count(OutboxMail, { toAddress: { $in: [stranger.user.email, sales.user.email] }, subject: { $like: `%${lead.reference}%` } })).toBe(0);

    await deliverMailTo(em(), teammate.user.email);
    const mail = await waitForMail({ to: teammate.user.email, subject: lead.reference });
    expect(mail.subject).toBe(`${sales.user.name} mentioned you on inquiry ${lead.reference}`);
    expect(mail.text).toContain('can you call back?');
    expect(mail.text).toContain(`/app/leads/${lead.id}`);
  });
});

describe('the call log', () => {
  test('bad input answers field-level 400s; another firm’s id 404', async () => {
    const { lead } = await aLead();
    const none = await post(callsRoute, sales, lead.id, 'calls', {});
    expect(none.status).toBe(400);
    expect((await none.json()).fields).toEqual({ outcome: 'Choose how the call went.' });
    const wrong = await post(callsRoute, sales, lead.id, 'calls', { outcome: 'busy' });
    expect((await wrong.json()).fields.outcome).toBe('Choose how the call went.');
    const long = await post(callsRoute, sales, lead.id, 'calls', { outcome: 'reached', note: 'x'.repeat(1001) });
    expect((await long.json()).fields.note).toMatch(/at most 1000/);
    expect((await post(callsRoute, stranger, lead.id, 'calls', { outcome: 'reached' })).status).toBe(404);
    expect(await eventsOf(lead.id, 'call')).toHaveLength(0);
  });

  test('every call counts as contact: the first sets the first contact, each moves the last', async () => {
    const clock = useFakeClock('2026-12-03T15:00:00Z');
    try {
      const { lead } = await aLead();
      expect((await post(callsRoute, sales, lead.id, 'calls', { outcome: 'no-answer' })).status).toBe(201);
      clock.advance(20 * MINUTE_MS);
      expect((await post(callsRoute, teammate, lead.id, 'calls', { outcome: 'reached', note: 'Wants a visit on Friday' })).status).toBe(201);
      const stored = await em().findOneOrFail(Lead, { id: lead.id });
      expect(stored.firstContactAt?.toISOString()).toBe('2026-12-03T15:00:00.000Z');
      expect(stored.lastContactAt?.toISOString()).toBe('2026-12-03T15:20:00.000Z');
      expect((await eventsOf(lead.id, 'call')).map((e) => e.data)).toEqual([{ outcome: 'no-answer' }, { outcome: 'reached', note: 'Wants a visit on Friday' }]);
    } finally {
      clock.restore();
    }
  });
});

describe('e-mail from a template', () => {
  test('a firm starts with three templates, made by the database when the firm is created', async () => {
    const templates = await em().find(MailTemplate, { company: firm.company.id }, { orderBy: { position: 'asc' } });
    expect(templates.map((t) => t.name)).toEqual(['First reply', 'Book a visit', 'Follow-up']);
    for (const t of templates) expect(t.body).toContain('{estimate_link}');
  });

  test('bad input answers field-level 400s; another firm’s lead or template 404', async () => {
    const { lead } = await aLead();
    const empty = await post(emailsRoute, sales, lead.id, 'emails', { subject: '', body: 'Hi' });
    expect(empty.status).toBe(400);
    expect((await empty.json()).fields).toEqual({ subject: 'Subject is required.' });
    const typo = await post(emailsRoute, sales, lead.id, 'emails', { subject: 'Hi', body: 'Hello {nmae}' });
    expect((await typo.json()).fields).toEqual({ body: 'Unknown placeholder: {nmae}.' });
    expect((await post(emailsRoute, stranger, lead.id, 'emails', { subject: 'Hi', body: 'Hello' })).status).toBe(404);
    const [foreignTemplate] = await em().find(MailTemplate, { company: otherFirm.company.id });
    expect((await post(emailsRoute, sales, lead.id, 'emails', { templateId: foreignTemplate!.id, subject: 'Hi', body: 'Hello' })).status).toBe(404);
    expect(await em().count(OutboxMail, { toAddress: lead.email })).toBe(0);
  });

  test('arrives at the SMTP stand-in in the firm’s name with a working estimate link; the first link still works', async () => {
    const { lead, firstKey } = await aLead();
    const [template] = await em().find(MailTemplate, { company: firm.company.id }, { orderBy: { position: 'asc' }, limit: 1 });
    const response = await post(emailsRoute, sales, lead.id, 'emails', { templateId: template!.id, subject: template!.subject, body: template!.body });
    expect(response.status).toBe(201);

    await deliverMailTo(em(), lead.email);
    const mail = await waitForMail({ to: lead.email, subject: lead.reference });
    expect(mail.subject).toBe(`Your wall estimate from ${firm.company.name} (${lead.reference})`);
    expect(mail.from.name).toBe(firm.company.name);
    expect(mail.text).toContain(`Hello ${lead.name},`);
    expect(mail.text).toContain(sales.user.name);
    const link = mail.text.match(/https?:\/\/\S+\/estimate\/([0-9a-f-]{36})\?key=([A-Za-z0-9_-]+)/);
    expect(link).not.toBeNull();
    expect(link![1]).toBe(lead.id);
    expect((await leadForViewKey(em(), lead.id, link![2]!)).id).toBe(lead.id);
    expect((await leadForViewKey(em(), lead.id, firstKey)).id).toBe(lead.id);
    await expect(leadForViewKey(em(), lead.id, newViewKey())).rejects.toBeInstanceOf(NotFound);
    expect(mail.html).toContain(`href="${link![0]}"`);

    // Kept on the inquiry: subject and body as sent, without the link's key; it counts as contact.
    const [sent] = await eventsOf(lead.id, 'email-sent');
    expect(sent!.data).toMatchObject({ subject: mail.subject, to: lead.email, template: 'First reply' });
    expect(sent!.data.body).toContain(KEPT_LINK_TEXT);
    expect(JSON.stringify(sent!.data)).not.toContain(link![2]);
    const outbox = await em().findOneOrFail(OutboxMail, { id: sent!.data.mailId as string });
    expect(outbox.toAddress).toBe(lead.email);
    const stored = await em().findOneOrFail(Lead, { id: lead.id });
    expect(stored.firstContactAt).not.toBeNull();
    expect(stored.lastContactAt).toEqual(stored.firstContactAt);
  });
});

describe('the firm’s templates', () => {
  test('sales read them; only the owner changes them; bad input 400 by field; another firm’s id 404', async () => {
    const listed = await call(templatesRoute.GET, sales, 'GET', '/api/app/mail-templates', {});
    expect(listed.status).toBe(200);
    const { templates } = await listed.json();
    expect(templates).toHaveLength(3);
    const body = { name: 'Price changed', subject: 'Your estimate {reference}', body: 'Hello {name}, see {estimate_link}' };
    expect((await call(templatesRoute.POST, sales, 'POST', '/api/app/mail-templates', {}, body)).status).toBe(404);
    const bad = await call(templatesRoute.POST, owner, 'POST', '/api/app/mail-templates', {}, { name: '', subject: 'Hi {when}', body: 'ok' });
    expect(bad.status).toBe(400);
    expect((await bad.json()).fields).toEqual({ name: 'Name is required.', subject: 'Unknown placeholder: {when}.' });

    const created = await call(templatesRoute.POST, owner, 'POST', '/api/app/mail-templates', {}, body);
    expect(created.status).toBe(201);
    const { id } = await created.json();
    const path = `/api/app/mail-templates/${id}`;
    const changed = await call(templateRoute.PATCH, owner, 'PATCH', path, { id }, { ...body, subject: 'New prices for {reference}' });
    expect((await changed.json()).subject).toBe('New prices for {reference}');
    expect((await call(templateRoute.PATCH, stranger, 'PATCH', path, { id }, body)).status).toBe(404);
    expect((await call(templateRoute.DELETE, stranger, 'DELETE', path, { id })).status).toBe(404);
    expect((await call(templateRoute.DELETE, sales, 'DELETE', path, { id })).status).toBe(404);
    expect((await call(templateRoute.DELETE, owner, 'DELETE', path, { id })).status).toBe(204);
    expect(await em().count(MailTemplate, { id })).toBe(0);
    // The other firm's templates are its own.
    const theirs = await (await call(templatesRoute.GET, stranger, 'GET', '/api/app/mail-templates', {})).json();
    expect(theirs.templates.map((t: { id: string }) => t.id)).not.toContain(templates[0].id);
  });
});

describe('photo links', () => {
  test('are signed afresh on every request, for the firm’s own staff only', async () => {
    const { lead } = await aLead();
    const setup = em();
    const photo = setup.create(LeadPhoto, {
      company: firm.company.id,
      draftId: crypto.randomUUID(),
      lead: lead.id,
      status: 'ready',
      uploadKey: `uploads/${firm.company.id}/x/${crypto.randomUUID()}`,
      imageKey: `photos/${firm.company.id}/${crypto.randomUUID()}.jpg`,
      thumbKey: `thumbs/${firm.company.id}/${crypto.randomUUID()}.jpg`,
      originalName: 'hall.jpg',
      width: 2000,
      height: 1500,
    });
    await setup.flush();
    const path = `/api/app/leads/${lead.id}/photos`;
    const answer = await (await call(photosRoute.GET, sales, 'GET', path, { id: lead.id })).json();
    expect(answer.photos).toEqual([expect.objectContaining({ id: photo.id, name: 'hall.jpg', width: 2000, height: 1500 })]);
    expect(answer.photos[0].imageUrl).toContain(photo.imageKey);
    expect(answer.photos[0].imageUrl).toMatch(/X-Amz-Expires=600\b/);
    expect(new Date(answer.expiresAt).getTime()).toBeGreaterThan(Date.now() + 9 * MINUTE_MS);
    expect((await call(photosRoute.GET, stranger, 'GET', path, { id: lead.id })).status).toBe(404);
    expect((await call(photosRoute.GET, null, 'GET', path, { id: lead.id })).status).toBe(401);
  });
});

describe('the homeowner viewing their estimate', () => {
  let clock: ReturnType<typeof useFakeClock> | undefined;
  afterEach(() => clock?.restore());

  test('is on the timeline at most once an hour, however often the page is loaded', async () => {
    clock = useFakeClock('2026-12-03T09:00:00Z');
    const { lead } = await aLead();
    const loaded = await em().findOneOrFail(Lead, { id: lead.id });
    const views = await Promise.all([recordHomeownerView(em(), loaded), recordHomeownerView(em(), loaded), recordHomeownerView(em(), loaded)]);
    expect(views.filter(Boolean)).toHaveLength(1);
    clock.advance(59 * MINUTE_MS);
    expect(await recordHomeownerView(em(), loaded)).toBe(false);
    clock.advance(HOUR_MS);
    expect(await recordHomeownerView(em(), loaded)).toBe(true);
    const events = await eventsOf(lead.id, 'viewed-by-homeowner');
    expect(events.map((e) => [e.at.toISOString(), e.actor, e.data])).toEqual([
      ['2026-12-03T09:00:00.000Z', null, {}],
      ['2026-12-03T10:59:00.000Z', null, {}],
    ]);
  });
});
