import { readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { expect, test, type APIRequestContext } from '@playwright/test';
import { signedInAs, signedOut } from './helpers/staff';
import { query } from '../helpers/app-database';
import { DEFAULT_LOST_REASONS } from '../../src/lib/shared/lead-flow-schemas';

/**
 * Every staff route, with the status each kind of caller gets. `other` is the owner of the second
 * demo firm using the first firm's ids: ids must answer 404 (not 403), so they are not confirmed.
 * Add a row for every new file under src/pages/app or src/pages/api/app; the last test fails otherwise.
 */
type Who = 'signedOut' | 'sales' | 'other' | 'owner';
type Ids = {
  samMember: string;
  oliveMember: string;
  invite: string;
  lead: string;
  template: string;
  receivedEvent: string;
  phoneLead: string;
  cancelledVisit: string;
  publishedRates: string;
  replay: string;
};
type Row = {
  route: string;
  method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  path: (ids: Ids) => string;
  json?: unknown | ((ids: Ids) => unknown);
  form?: (ids: Ids) => Record<string, string>;
  expect: Record<Who, number>;
};

const MATRIX: Row[] = [
  { route: '/app', method: 'GET', path: () => '/app', expect: { signedOut: 302, sales: 200, other: 200, owner: 200 } },
  { route: '/app/leads/[id]', method: 'GET', path: (ids) => `/app/leads/${ids.lead}`, expect: { signedOut: 302, sales: 200, other: 404, owner: 200 } },
  { route: '/app/visits', method: 'GET', path: () => '/app/visits', expect: { signedOut: 302, sales: 200, other: 200, owner: 200 } },
  { route: '/app/rates', method: 'GET', path: () => '/app/rates', expect: { signedOut: 302, sales: 404, other: 200, owner: 200 } },
  { route: '/app/rates/edit', method: 'GET', path: () => '/app/rates/edit', expect: { signedOut: 302, sales: 404, other: 200, owner: 200 } },
  { route: '/app/setup', method: 'GET', path: () => '/app/setup', expect: { signedOut: 302, sales: 404, other: 200, owner: 200 } },
  { route: '/app/setup/team', method: 'GET', path: () => '/app/setup/team', expect: { signedOut: 302, sales: 404, other: 200, owner: 200 } },
  {
    route: '/app/setup/team',
    method: 'POST',
    path: () => '/app/setup/team',
    // Sets Sam's role to what it already is: allowed callers change nothing.
    form: (ids) => ({ intent: 'role', id: ids.samMember, role: 'sales' }),
    expect: { signedOut: 302, sales: 404, other: 404, owner: 303 },
  },
  {
    route: '/app/setup/lost-reasons',
    method: 'GET',
    path: () => '/app/setup/lost-reasons',
    expect: { signedOut: 302, sales: 404, other: 200, owner: 200 },
  },
  // Reports are the owner's; sales staff are not told they exist (404). The other firm's owner sees their own firm's figures.
  { route: '/app/reports', method: 'GET', path: () => '/app/reports', expect: { signedOut: 302, sales: 404, other: 200, owner: 200 } },
  {
    route: '/api/app/reports/[report].csv',
    method: 'GET',
    path: () => '/api/app/reports/funnel.csv',
    expect: { signedOut: 401, sales: 404, other: 200, owner: 200 },
  },
  { route: '/app/account', method: 'GET', path: () => '/app/account', expect: { signedOut: 302, sales: 200, other: 200, owner: 200 } },
  { route: '/api/app/me', method: 'GET', path: () => '/api/app/me', expect: { signedOut: 401, sales: 200, other: 200, owner: 200 } },
  { route: '/api/app/leads', method: 'GET', path: () => '/api/app/leads?sort=name', expect: { signedOut: 401, sales: 200, other: 200, owner: 200 } },
  // The other firm's owner exports their own firm's list: allowed, and none of the first firm's rows.
  { route: '/api/app/leads/export', method: 'GET', path: () => '/api/app/leads/export', expect: { signedOut: 401, sales: 403, other: 200, owner: 200 } },
  { route: '/api/app/me/list-columns', method: 'GET', path: () => '/api/app/me/list-columns', expect: { signedOut: 401, sales: 200, other: 200, owner: 200 } },
  {
    route: '/api/app/me/list-columns',
    method: 'PUT',
    path: () => '/api/app/me/list-columns',
    // Every column, which is also what each person sees before choosing: changes nothing anyone sees.
    json: {
      columns: ['reference', 'name', 'place', 'finish', 'area', 'range', 'stage', 'assignee', 'received', 'waiting', 'followUp', 'score'],
    },
    expect: { signedOut: 401, sales: 200, other: 200, owner: 200 },
  },
  { route: '/api/app/team', method: 'GET', path: () => '/api/app/team', expect: { signedOut: 401, sales: 404, other: 200, owner: 200 } },
  {
    route: '/api/app/team/invites',
    method: 'POST',
    path: () => '/api/app/team/invites',
    json: { email: 'matrix-newcomer@firm.test', role: 'sales' },
    // The other firm's owner invites to their own firm: allowed, and it touches nothing of the first firm.
    expect: { signedOut: 401, sales: 404, other: 201, owner: 201 },
  },
  {
    route: '/api/app/team/invites/[id]',
    method: 'DELETE',
    path: (ids) => `/api/app/team/invites/${ids.invite}`,
    expect: { signedOut: 401, sales: 404, other: 404, owner: 204 },
  },
  {
    route: '/api/app/team/members/[id]',
    method: 'PATCH',
    path: (ids) => `/api/app/team/members/${ids.samMember}`,
    json: { role: 'sales' },
    expect: { signedOut: 401, sales: 404, other: 404, owner: 200 },
  },
  {
    route: '/api/app/team/members/[id]',
    method: 'DELETE',
    // Olive is the only owner: the owner's own call is refused as "last owner" (409), never done.
    path: (ids) => `/api/app/team/members/${ids.oliveMember}`,
    expect: { signedOut: 401, sales: 404, other: 404, owner: 409 },
  },
  // Working an inquiry (notes, calls, e-mail, photos) and the firm's e-mail templates.
  {
    route: '/app/setup/mail-templates',
    method: 'GET',
    path: () => '/app/setup/mail-templates',
    expect: { signedOut: 302, sales: 404, other: 200, owner: 200 },
  },
  {
    route: '/api/app/leads/[id]/notes',
    method: 'POST',
    path: (ids) => `/api/app/leads/${ids.lead}/notes`,
    json: { text: 'Checked by the role matrix.' },
    expect: { signedOut: 401, sales: 201, other: 404, owner: 201 },
  },
  {
    route: '/api/app/leads/[id]/calls',
    method: 'POST',
    path: (ids) => `/api/app/leads/${ids.lead}/calls`,
    json: { outcome: 'no-answer' },
    expect: { signedOut: 401, sales: 201, other: 404, owner: 201 },
  },
  {
    route: '/api/app/leads/[id]/emails',
    method: 'POST',
    path: (ids) => `/api/app/leads/${ids.lead}/emails`,
    // An empty subject: allowed callers get past the guard to the field check, and no mail is sent.
    json: { subject: '', body: 'Hello {name}' },
    expect: { signedOut: 401, sales: 400, other: 404, owner: 400 },
  },
  {
    route: '/api/app/leads/[id]/photos',
    method: 'GET',
    path: (ids) => `/api/app/leads/${ids.lead}/photos`,
    expect: { signedOut: 401, sales: 200, other: 404, owner: 200 },
  },
  { route: '/api/app/mail-templates', method: 'GET', path: () => '/api/app/mail-templates', expect: { signedOut: 401, sales: 200, other: 200, owner: 200 } },
  {
    route: '/api/app/mail-templates',
    method: 'POST',
    path: () => '/api/app/mail-templates',
    json: { name: 'Matrix check', subject: 'Hello {name}', body: 'Checked by the role matrix.' },
    // The other firm's owner adds to their own firm.
    expect: { signedOut: 401, sales: 404, other: 201, owner: 201 },
  },
  {
    route: '/api/app/mail-templates/[id]',
    method: 'PATCH',
    path: (ids) => `/api/app/mail-templates/${ids.template}`,
    json: { name: 'Matrix target', subject: 'Hello {name}', body: 'Checked by the role matrix.' },
    expect: { signedOut: 401, sales: 404, other: 404, owner: 200 },
  },
  {
    route: '/api/app/mail-templates/[id]',
    method: 'DELETE',
    path: (ids) => `/api/app/mail-templates/${ids.template}`,
    expect: { signedOut: 401, sales: 404, other: 404, owner: 204 },
  },
  // The inquiry page's workflow routes. Bodies that reach the rules are refused (400/409), so no
  // caller changes the demo inquiry; another firm's owner gets 404 before the body is read.
  {
    route: '/api/app/leads/[id]/timeline',
    method: 'GET',
    path: (ids) => `/api/app/leads/${ids.lead}/timeline`,
    expect: { signedOut: 401, sales: 200, other: 404, owner: 200 },
  },
  {
    route: '/api/app/leads/[id]/stage',
    method: 'POST',
    path: (ids) => `/api/app/leads/${ids.lead}/stage`,
    json: { to: 'no-such-stage' },
    expect: { signedOut: 401, sales: 400, other: 404, owner: 400 },
  },
  {
    route: '/api/app/leads/[id]/assignee',
    method: 'PUT',
    path: (ids) => `/api/app/leads/${ids.lead}/assignee`,
    json: { membershipId: 'nobody-here' },
    expect: { signedOut: 401, sales: 400, other: 404, owner: 400 },
  },
  {
    route: '/api/app/leads/[id]/follow-up',
    method: 'PUT',
    path: (ids) => `/api/app/leads/${ids.lead}/follow-up`,
    json: { at: '2020-01-01T09:00' },
    expect: { signedOut: 401, sales: 400, other: 404, owner: 400 },
  },
  {
    // "Received" is never undoable: allowed callers get 409 and nothing changes.
    route: '/api/app/leads/[id]/events/[eventId]/undo',
    method: 'POST',
    path: (ids) => `/api/app/leads/${ids.lead}/events/${ids.receivedEvent}/undo`,
    expect: { signedOut: 401, sales: 409, other: 404, owner: 409 },
  },
  {
    route: '/api/app/settings/lost-reasons',
    method: 'GET',
    path: () => '/api/app/settings/lost-reasons',
    expect: { signedOut: 401, sales: 200, other: 200, owner: 200 },
  },
  {
    // Saves the defaults: the other firm's owner sets their own firm's list, nothing of the first firm's.
    route: '/api/app/settings/lost-reasons',
    method: 'PUT',
    path: () => '/api/app/settings/lost-reasons',
    json: { reasons: [...DEFAULT_LOST_REASONS] },
    expect: { signedOut: 401, sales: 404, other: 200, owner: 200 },
  },
  { route: '/app/leads/new', method: 'GET', path: () => '/app/leads/new', expect: { signedOut: 302, sales: 200, other: 200, owner: 200 } },
  { route: '/app/leads/deleted', method: 'GET', path: () => '/app/leads/deleted', expect: { signedOut: 302, sales: 403, other: 200, owner: 200 } },
  {
    route: '/api/app/leads',
    method: 'POST',
    path: () => '/api/app/leads',
    // No consent and no rooms: every caller allowed in is refused on the fields, and nothing is stored.
    json: { idempotencyKey: 'matrix-phone-inquiry-0001', project: { rooms: [] }, contact: { name: 'Matrix' } },
    expect: { signedOut: 401, sales: 400, other: 400, owner: 400 },
  },
  {
    route: '/api/app/leads/estimate',
    method: 'POST',
    // Prices the rooms and stores nothing.
    path: () => '/api/app/leads/estimate',
    json: {
      project: {
        rooms: [{ name: 'Hall', ceilingHeight: 96, walls: [{ length: 120 }], treatment: { id: 'beadboard', height: 'wainscot' } }],
        builtBefore1978: 'no',
        measuredBy: 'homeowner-tape',
      },
    },
    expect: { signedOut: 401, sales: 200, other: 200, owner: 200 },
  },
  {
    route: '/api/app/leads/[id]/merge',
    method: 'POST',
    // Into itself: refused as bad input by those allowed, before anything moves.
    path: (ids) => `/api/app/leads/${ids.lead}/merge`,
    json: (ids: Ids) => ({ into: ids.lead }),
    expect: { signedOut: 401, sales: 400, other: 404, owner: 400 },
  },
  {
    route: '/api/app/leads/[id]',
    method: 'DELETE',
    // The phone inquiry made for this test; the owner's delete is undone by the next row.
    path: (ids) => `/api/app/leads/${ids.phoneLead}`,
    expect: { signedOut: 401, sales: 403, other: 404, owner: 200 },
  },
  {
    route: '/api/app/leads/[id]/restore',
    method: 'POST',
    path: (ids) => `/api/app/leads/${ids.phoneLead}/restore`,
    expect: { signedOut: 401, sales: 403, other: 404, owner: 200 },
  },
  {
    route: '/api/app/me/notifications',
    method: 'PATCH',
    path: () => '/api/app/me/notifications',
    json: { newInquiryMail: true },
    expect: { signedOut: 401, sales: 200, other: 200, owner: 200 },
  },
  // Visits. The booking body is refused (400) and the visit is already cancelled (409), so no
  // caller books or moves anything; another firm's owner gets 404 before the body is read.
  { route: '/api/app/visits/slots', method: 'GET', path: () => '/api/app/visits/slots', expect: { signedOut: 401, sales: 200, other: 200, owner: 200 } },
  {
    route: '/api/app/leads/[id]/visits',
    method: 'POST',
    path: (ids) => `/api/app/leads/${ids.lead}/visits`,
    json: (ids: Ids) => ({ start: 'not a time', salespersonId: ids.samMember }),
    expect: { signedOut: 401, sales: 400, other: 404, owner: 400 },
  },
  {
    route: '/api/app/visits/[id]/move',
    method: 'POST',
    path: (ids) => `/api/app/visits/${ids.cancelledVisit}/move`,
    json: { start: '2031-01-06T15:00:00.000Z' },
    expect: { signedOut: 401, sales: 409, other: 404, owner: 409 },
  },
  {
    route: '/api/app/visits/[id]/cancel',
    method: 'POST',
    path: (ids) => `/api/app/visits/${ids.cancelledVisit}/cancel`,
    expect: { signedOut: 401, sales: 409, other: 404, owner: 409 },
  },
  // After the visit: an outcome that is neither done nor no one home, and rooms that are no project (400).
  {
    route: '/api/app/visits/[id]/outcome',
    method: 'POST',
    path: (ids) => `/api/app/visits/${ids.cancelledVisit}/outcome`,
    json: { outcome: 'maybe' },
    expect: { signedOut: 401, sales: 400, other: 404, owner: 400 },
  },
  {
    route: '/api/app/leads/[id]/measured-rooms',
    method: 'PUT',
    path: (ids) => `/api/app/leads/${ids.lead}/measured-rooms`,
    json: { project: {} },
    expect: { signedOut: 401, sales: 400, other: 404, owner: 400 },
  },
  // The Visits calendar, hours and settings. Bodies are refused (400) or the caller is (403/404),
  // so nobody's hours or the firm's settings change.
  { route: '/app/visits/hours', method: 'GET', path: () => '/app/visits/hours', expect: { signedOut: 302, sales: 200, other: 200, owner: 200 } },
  { route: '/app/setup/visits', method: 'GET', path: () => '/app/setup/visits', expect: { signedOut: 302, sales: 404, other: 200, owner: 200 } },
  {
    route: '/api/app/visits',
    method: 'GET',
    path: () => '/api/app/visits?from=2031-01-06T00:00:00.000Z&to=2031-01-13T00:00:00.000Z',
    expect: { signedOut: 401, sales: 200, other: 200, owner: 200 },
  },
  {
    route: '/api/app/visits/availability/[membershipId]',
    method: 'GET',
    path: (ids) => `/api/app/visits/availability/${ids.samMember}`,
    expect: { signedOut: 401, sales: 200, other: 404, owner: 200 },
  },
  {
    // The owner's hours: Sam may not change them (403); the owner's own call is refused on the field.
    route: '/api/app/visits/availability/[membershipId]',
    method: 'PUT',
    path: (ids) => `/api/app/visits/availability/${ids.oliveMember}`,
    json: { weekly: { mon: [{ from: '12:00', to: '09:00' }] }, daysOff: [] },
    expect: { signedOut: 401, sales: 403, other: 404, owner: 400 },
  },
  {
    route: '/api/app/settings/visits',
    method: 'PUT',
    path: () => '/api/app/settings/visits',
    json: { visitMinutes: 60, bufferMinutes: 30, stepMinutes: 30, minNoticeMinutes: 1440, horizonDays: 28, onlineBooking: false, timeZone: 'Nowhere/Atall' },
    expect: { signedOut: 401, sales: 404, other: 400, owner: 400 },
  },
  // Setup's own pages and settings: hidden from sales (404). Each body is refused on a field (400),
  // so no firm's profile, service area, notifications or widget sites change.
  { route: '/app/setup/profile', method: 'GET', path: () => '/app/setup/profile', expect: { signedOut: 302, sales: 404, other: 200, owner: 200 } },
  { route: '/app/setup/service-area', method: 'GET', path: () => '/app/setup/service-area', expect: { signedOut: 302, sales: 404, other: 200, owner: 200 } },
  { route: '/app/setup/notifications', method: 'GET', path: () => '/app/setup/notifications', expect: { signedOut: 302, sales: 404, other: 200, owner: 200 } },
  { route: '/app/setup/widget', method: 'GET', path: () => '/app/setup/widget', expect: { signedOut: 302, sales: 404, other: 200, owner: 200 } },
  {
    route: '/api/app/settings/profile',
    method: 'PUT',
    path: () => '/api/app/settings/profile',
    json: { name: '' },
    expect: { signedOut: 401, sales: 404, other: 400, owner: 400 },
  },
  {
    route: '/api/app/settings/service-area',
    method: 'PUT',
    path: () => '/api/app/settings/service-area',
    json: { kind: 'circle' },
    expect: { signedOut: 401, sales: 404, other: 400, owner: 400 },
  },
  {
    route: '/api/app/settings/notifications',
    method: 'PUT',
    path: () => '/api/app/settings/notifications',
    json: { extraEmails: ['not an address'], responseTargetMinutes: 60 },
    expect: { signedOut: 401, sales: 404, other: 400, owner: 400 },
  },
  {
    route: '/api/app/settings/widget',
    method: 'PUT',
    path: () => '/api/app/settings/widget',
    json: { embedOrigins: ['not a site'] },
    expect: { signedOut: 401, sales: 404, other: 400, owner: 400 },
  },
  // The Rate book: owners only, and hidden from sales (404, as if the pages did not exist). Opening
  // the draft that the demo firm already has changes nothing; saves and publishes with revision 0 are
  // refused on the field (400), so no caller changes any numbers.
  { route: '/api/app/rates', method: 'GET', path: () => '/api/app/rates', expect: { signedOut: 401, sales: 404, other: 200, owner: 200 } },
  {
    route: '/api/app/rates/compare',
    method: 'GET',
    path: (ids) => `/api/app/rates/compare?before=${ids.publishedRates}&after=${ids.publishedRates}`,
    expect: { signedOut: 401, sales: 404, other: 404, owner: 200 },
  },
  {
    route: '/api/app/rates/draft',
    method: 'POST',
    path: () => '/api/app/rates/draft',
    json: {},
    expect: { signedOut: 401, sales: 404, other: 200, owner: 200 },
  },
  {
    route: '/api/app/rates/draft',
    method: 'PUT',
    path: () => '/api/app/rates/draft',
    json: { revision: 0, data: {} },
    expect: { signedOut: 401, sales: 404, other: 400, owner: 400 },
  },
  {
    route: '/api/app/rates/draft',
    method: 'DELETE',
    path: () => '/api/app/rates/draft',
    json: { revision: 0 },
    expect: { signedOut: 401, sales: 404, other: 400, owner: 400 },
  },
  {
    route: '/api/app/rates/draft/publish',
    method: 'POST',
    path: () => '/api/app/rates/draft/publish',
    json: { revision: 0 },
    expect: { signedOut: 401, sales: 404, other: 400, owner: 400 },
  },
  {
    route: '/api/app/rates/draft/preview',
    method: 'GET',
    path: () => '/api/app/rates/draft/preview',
    expect: { signedOut: 401, sales: 404, other: 200, owner: 200 },
  },
  {
    route: '/api/app/rates/draft/replay',
    method: 'POST',
    path: () => '/api/app/rates/draft/replay',
    expect: { signedOut: 401, sales: 404, other: 200, owner: 200 },
  },
  {
    route: '/api/app/rates/draft/replay/[id]',
    method: 'GET',
    path: (ids) => `/api/app/rates/draft/replay/${ids.replay}`,
    expect: { signedOut: 401, sales: 404, other: 404, owner: 200 },
  },
];

// Owners last, so the destructive calls of everyone else meet the rows still in place.
const CALLERS: Who[] = ['signedOut', 'sales', 'other', 'owner'];

let clients: Record<Who, APIRequestContext>;
let ids: Ids;

test.beforeAll(async () => {
  clients = {
    signedOut: await signedOut(),
    sales: await signedInAs('sam@cedar-hollow.test'),
    other: await signedInAs('nora@northgate.test'),
    owner: await signedInAs('olive@cedar-hollow.test'),
  };
  const invite = await clients.owner.post('/api/app/team/invites', { data: { email: 'matrix-target@cedar-hollow.test', role: 'sales' } });
  expect(invite.status()).toBe(201);
  const team = await (await clients.owner.get('/api/app/team')).json();
  const member = (email: string) => team.members.find((m: { email: string }) => m.email === email).id;
  const [lead] = await query<{ id: string }>(`select l.id from lead l join company c on c.id = l.company_id where c.slug = 'cedar-hollow' limit 1`);
  const template = await clients.owner.post('/api/app/mail-templates', {
    data: { name: 'Matrix target', subject: 'Hello {name}', body: 'Checked by the role matrix.' },
  });
  expect(template.status()).toBe(201);
  const [received] = await query<{ id: string }>(`select id from lead_event where lead_id = $1 and kind = 'received' limit 1`, [lead!.id]);
  const phone = await clients.owner.post('/api/app/leads', {
    data: {
      idempotencyKey: 'matrix-phone-inquiry-0002',
      project: {
        rooms: [{ name: 'Hall', ceilingHeight: 96, walls: [{ length: 120 }], treatment: { id: 'beadboard', height: 'wainscot' } }],
        builtBefore1978: 'no',
        measuredBy: 'homeowner-tape',
      },
      contact: {
        name: 'Matrix Phone',
        email: 'matrix-phone@homeowner.test',
        phone: '(512) 555-0133',
        address: '3 Test Row',
        postcode: '78704',
        preferredContact: 'phone',
        consent: true,
      },
    },
  });
  expect(phone.status()).toBe(201);
  // A visit already cancelled: moving or cancelling it is refused whoever asks.
  const [cancelledVisit] = await query<{ id: string }>(
    `insert into "visit" ("id", "company_id", "lead_id", "salesperson_id", "starts_at", "ends_at", "blocked_until", "status", "booked_via", "cancelled_at", "cancelled_by")
     select gen_random_uuid(), l."company_id", l."id", null, '2031-01-06T15:00Z', '2031-01-06T16:00Z', '2031-01-06T16:30Z', 'cancelled', 'staff', now(), 'staff'
     from "lead" l where l."id" = $1 returning "id"`,
    [lead!.id],
  );
  const [publishedRates] = await query<{ id: string }>(
    `select v.id from rate_book_version v join company c on c.id = v.company_id where c.slug = 'cedar-hollow' and v.status = 'published'`,
  );
  const replay = await clients.owner.post('/api/app/rates/draft/replay');
  expect([200, 202]).toContain(replay.status());
  ids = {
    publishedRates: publishedRates!.id,
    replay: (await replay.json()).id,
    samMember: member('sam@cedar-hollow.test'),
    oliveMember: member('olive@cedar-hollow.test'),
    invite: (await invite.json()).id,
    lead: lead!.id,
    template: (await template.json()).id,
    receivedEvent: received!.id,
    phoneLead: (await phone.json()).lead.id,
    cancelledVisit: cancelledVisit!.id,
  };
});

test.afterAll(async () => {
  await Promise.all(Object.values(clients ?? {}).map((client) => client.dispose()));
});

function call(client: APIRequestContext, row: Row) {
  const url = row.path(ids);
  const json = typeof row.json === 'function' ? row.json(ids) : row.json;
  const options = { maxRedirects: 0, ...(json ? { data: json } : {}), ...(row.form ? { form: row.form(ids) } : {}) };
  return client.fetch(url, { method: row.method, ...options });
}

test('every staff route answers each kind of caller as the matrix says', async () => {
  test.setTimeout(60_000);
  const firstFirmTeamBefore = await (await clients.owner.get('/api/app/team')).json();
  const seen: string[] = [];
  for (const row of MATRIX) {
    for (const who of CALLERS) {
      const response = await call(clients[who], row);
      seen.push(`${row.method} ${row.route} as ${who}: ${response.status()}`);
      if (who === 'signedOut' && response.status() === 302) expect(response.headers().location).toMatch(/^\/login\?next=/);
      if (response.status() >= 400 && row.route.startsWith('/api/')) expect(await response.json()).toHaveProperty('error');
    }
  }
  expect(seen).toEqual(MATRIX.flatMap((row) => CALLERS.map((who) => `${row.method} ${row.route} as ${who}: ${row.expect[who]}`)));

  // Nothing the other firm (or sales) tried changed the first firm's team; only the owner's own
  // withdrawal of the invitation did.
  const after = await (await clients.owner.get('/api/app/team')).json();
  expect(after.members).toEqual(firstFirmTeamBefore.members);
  expect(after.invites.map((i: { id: string }) => i.id)).not.toContain(ids.invite);
});

test('the other firm sees only its own people and cannot switch into the first firm', async () => {
  const team = await (await clients.other.get('/api/app/team')).json();
  expect(team.members.map((m: { email: string }) => m.email)).toEqual(['nora@northgate.test']);
  const page = await (await clients.other.get('/app/setup/team')).text();
  expect(page).not.toContain('cedar-hollow.test');
  const me = await (await clients.owner.get('/api/app/me')).json();
  const switched = await clients.other.post('/api/auth/firm', { form: { companyId: me.firm.id }, maxRedirects: 0 });
  expect(switched.status()).toBe(404);
  expect((await (await clients.other.get('/api/app/me')).json()).firm.name).toBe('Northgate Wallworks');
});

function routeOf(file: string, root: string, prefix: string): string {
  const relative = path
    .relative(root, file)
    .replace(/\.(astro|ts)$/, '')
    .replace(/(^|\/)index$/, '');
  return relative ? `${prefix}/${relative}` : prefix;
}

function routeFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((entry) => {
    const full = path.join(dir, entry);
    return statSync(full).isDirectory() ? routeFiles(full) : [full];
  });
}

test('the matrix lists every staff route file', () => {
  const routes = [
    ...routeFiles('src/pages/app').map((f) => routeOf(f, 'src/pages/app', '/app')),
    ...routeFiles('src/pages/api/app').map((f) => routeOf(f, 'src/pages/api/app', '/api/app')),
  ];
  const listed = new Set(MATRIX.map((row) => row.route));
  expect(routes.filter((route) => !listed.has(route))).toEqual([]);
});
