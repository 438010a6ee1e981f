import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { fc, test as fcTest } from '@fast-check/vitest';
import type { APIRoute } from 'astro';
import type { MikroORM } from '@mikro-orm/postgresql';
import { getOrm } from '../../src/lib/server/boot/orm';
import { Company } from '../../src/lib/server/companies/company.entity';
import { companyBySlug } from '../../src/lib/server/companies/company.repository';
import { servesPostcode } from '../../src/lib/server/companies/service-area';
import { allowedOrigin } from '../../src/lib/server/embed/cors';
import { frameAncestors } from '../../src/lib/server/embed/embed-settings';
import { newInquiryRecipients } from '../../src/lib/server/leads/new-inquiry-mail';
import { NotFound } from '../../src/lib/server/errors';
import * as profileRoute from '../../src/pages/api/app/settings/profile';
import * as serviceAreaRoute from '../../src/pages/api/app/settings/service-area';
import * as notificationsRoute from '../../src/pages/api/app/settings/notifications';
import * as widgetRoute from '../../src/pages/api/app/settings/widget';
import * as visitsRoute from '../../src/pages/api/app/settings/visits';
import * as lostReasonsRoute from '../../src/pages/api/app/settings/lost-reasons';
import * as teamRoute from '../../src/pages/api/app/team/index';
import * as memberRoute from '../../src/pages/api/app/team/members/[id]';
import * as invitesRoute from '../../src/pages/api/app/team/invites/index';
import * as inviteRoute from '../../src/pages/api/app/team/invites/[id]';
import * as templatesRoute from '../../src/pages/api/app/mail-templates/index';
import * as templateRoute from '../../src/pages/api/app/mail-templates/[id]';
import { buildFirm } from '../helpers/accounts';
import { callAsStaff, type StaffCaller } from '../helpers/as-staff';
import { PAGES, renderStaffPage, textOf } from '../helpers/staff-pages';

// Setup's settings routes and pages: owners only (everyone else 404), one firm's settings never
// reachable from another's session, a field-level message for each bad input, and no 500 for any body.

let orm: MikroORM;
beforeAll(async () => {
  orm = await getOrm();
});
afterAll(async () => {
  await orm.close();
});
const em = () => orm.em.fork();

async function firm() {
  const built = await buildFirm(em(), [
    { name: 'Ottilie', role: 'owner' },
    { name: 'Sela', role: 'sales' },
  ]);
  const as = (index: number): StaffCaller & { em: ReturnType<typeof em> } => ({
    em: em(),
    company: built.company,
    user: built.members[index]!.user,
    membership: built.members[index]!.membership,
  });
  return { ...built, owner: as(0), sales: as(1) };
}

const put = (route: { PUT: APIRoute }, as: StaffCaller, path: string, body: unknown) => callAsStaff(route.PUT, as, { em: em(), method: 'PUT', path, body });
const reload = (id: string) => em().findOneOrFail(Company, { id });

const goodProfile = {
  name: 'Alder & Sons Finish Carpentry',
  phone: '(512) 555-0188',
  contactEmail: 'Office@Alder-Sons.test',
  website: 'https://www.alder-sons.test',
  addressStreet: '40 Quarry Lane',
  addressCity: 'Austin',
  addressRegion: 'TX',
  addressPostcode: '78701',
  timeZone: 'America/Chicago',
  brandColor: '#1d4e89',
};

const SETTINGS = [
  { route: profileRoute, path: '/api/app/settings/profile', body: goodProfile },
  { route: serviceAreaRoute, path: '/api/app/settings/service-area', body: { kind: 'postcodes', postcodes: ['787'] } },
  { route: notificationsRoute, path: '/api/app/settings/notifications', body: { extraEmails: ['desk@alder.test'], responseTargetMinutes: 120 } },
  { route: widgetRoute, path: '/api/app/settings/widget', body: { embedOrigins: ['https://www.alder.test'] } },
] as const;

describe('who may use Setup', () => {
  test('sales get 404 from every Setup page and every Setup route; the owner gets the pages', async () => {
    const f = await firm();
    for (const page of Object.keys(PAGES).filter((name) => name === 'team' || name.startsWith('setup')) as (keyof typeof PAGES)[]) {
      await expect(renderStaffPage(page, f.sales, '/app/setup'), page).rejects.toBeInstanceOf(NotFound);
      expect(textOf(await renderStaffPage(page, f.owner, '/app/setup')), page).toContain('Setup');
    }
    const id = f.owner.membership.id;
    const calls: [APIRoute, string, string, unknown, Record<string, string>?][] = [
      ...SETTINGS.map(({ route, path, body }) => [route.PUT, 'PUT', path, body] as [APIRoute, string, string, unknown]),
      [visitsRoute.PUT, 'PUT', '/api/app/settings/visits', {}],
      [lostReasonsRoute.PUT, 'PUT', '/api/app/settings/lost-reasons', { reasons: ['Too dear'] }],
      [teamRoute.GET, 'GET', '/api/app/team', undefined],
      [memberRoute.PATCH, 'PATCH', `/api/app/team/members/${id}`, { role: 'sales' }, { id }],
      [memberRoute.DELETE, 'DELETE', `/api/app/team/members/${id}`, undefined, { id }],
      [invitesRoute.POST, 'POST', '/api/app/team/invites', { email: 'new@alder.test', role: 'sales' }],
      [inviteRoute.DELETE, 'DELETE', `/api/app/team/invites/${id}`, undefined, { id }],
      [templatesRoute.POST, 'POST', '/api/app/mail-templates', { name: 'x', subject: 'x', body: 'x' }],
      [templateRoute.PATCH, 'PATCH', `/api/app/mail-templates/${id}`, { name: 'x', subject: 'x', body: 'x' }, { id }],
      [templateRoute.DELETE, 'DELETE', `/api/app/mail-templates/${id}`, undefined, { id }],
    ];
    for (const [handler, method, path, body, params] of calls) {
      const answer = await callAsStaff(handler, f.sales, { em: em(), method, path, body, params });
      expect(answer.status, `${method} ${path}`).toBe(404);
    }
    // Nothing the salesperson sent was kept.
    const company = await reload(f.company.id);
    expect([company.name, company.embedOrigins, company.servicePostcodes, company.notificationEmails]).toEqual([f.company.name, [], [], []]);
  });

  test('another firm’s owner reads and changes only their own firm', async () => {
    const f = await firm();
    const other = await firm();
    await put(widgetRoute, f.owner, '/api/app/settings/widget', { embedOrigins: ['https://first.test'] });
    const theirPage = textOf(await renderStaffPage('setupWidget', other.owner, '/app/setup/widget'));
    expect(theirPage).not.toContain('https://first.test');
    expect(theirPage).not.toContain(f.company.slug);
    for (const { route, path, body } of SETTINGS) expect((await put(route, other.owner, path, body)).status, path).toBe(200);
    const first = await reload(f.company.id);
    expect([first.name, first.embedOrigins, first.servicePostcodes, first.notificationEmails]).toEqual([f.company.name, ['https://first.test'], [], []]);
    const second = await reload(other.company.id);
    expect([second.name, second.embedOrigins, second.notificationEmails]).toEqual([goodProfile.name, ['https://www.alder.test'], ['desk@alder.test']]);
  });
});

describe('the firm profile', () => {
  test('is saved as normalised (phone in international format, e-mail lower-case, colour upper-case) and shown on the page', async () => {
    const f = await firm();
    const saved = await put(profileRoute, f.owner, '/api/app/settings/profile', goodProfile);
    expect(saved.status).toBe(200);
    expect(await saved.json()).toEqual({ ...goodProfile, phone: '+1 512 555 0188', contactEmail: 'office@alder-sons.test', brandColor: '#1D4E89' });
    const blanked = await put(profileRoute, f.owner, '/api/app/settings/profile', { ...goodProfile, phone: ' ', website: '', addressStreet: '' });
    expect(await blanked.json()).toMatchObject({ phone: null, website: null, addressStreet: null });
    const page = textOf(await renderStaffPage('setupProfile', f.owner, '/app/setup/profile'));
    // A firm without a published Rate book shows the defaults, and says where they are changed.
    expect(page).toContain('Currency USD');
    expect(page).toContain('belong to the Rate book');
  });

  test('bad input gets a message on each field, and nothing is saved', async () => {
    const f = await firm();
    const answer = await put(profileRoute, f.owner, '/api/app/settings/profile', {
      ...goodProfile,
      name: ' ',
      phone: '555',
      contactEmail: 'office at alder',
      website: 'alder.test/home',
      addressPostcode: '#!',
      timeZone: 'Mars/Olympus_Mons',
      // Mid grey: white on it reaches 4.48:1 and our ink 3.3:1, so neither passes.
      // Source: WCAG 2.2 relative luminance and contrast ratio definitions; SC 1.4.3 asks 4.5:1.
      brandColor: '#777777',
    });
    expect(answer.status).toBe(400);
    const { fields } = await answer.json();
    expect(Object.keys(fields).sort()).toEqual(['addressPostcode', 'brandColor', 'contactEmail', 'name', 'phone', 'timeZone', 'website']);
    expect(fields.timeZone).toMatch(/^Unknown time zone/);
    expect(fields.brandColor).toContain('only 4.4:1');
    expect(fields.brandColor).toContain('4.5:1');
    const malformed = await put(profileRoute, f.owner, '/api/app/settings/profile', { ...goodProfile, brandColor: 'blue', extra: 1 });
    expect(await malformed.json()).toMatchObject({
      fields: { brandColor: 'Use a colour written like #2F6B4F.', extra: expect.stringContaining('Unknown field') },
    });
    expect((await reload(f.company.id)).name).toBe(f.company.name);
  });

  test('a colour that passes with either text is accepted', async () => {
    const f = await firm();
    // #767676 on white is 4.54:1, the lightest grey passing AA. Source: WCAG 2.2 Understanding SC 1.4.3 (from memory).
    expect((await put(profileRoute, f.owner, '/api/app/settings/profile', { ...goodProfile, brandColor: '#767676' })).status).toBe(200);
    // A light yellow carries our ink well above 4.5:1.
    expect((await put(profileRoute, f.owner, '/api/app/settings/profile', { ...goodProfile, brandColor: '#F4D35E' })).status).toBe(200);
  });
});

describe('the widget’s allowed sites', () => {
  test('each entry is read as an origin; a bad or repeated entry is refused by its position with its text', async () => {
    const f = await firm();
    const bad = await put(widgetRoute, f.owner, '/api/app/settings/widget', {
      embedOrigins: [
        'https://www.alder.test/',
        'HTTPS://WWW.ALDER.TEST',
        'https://alder.test/contact',
        'ftp://alder.test',
        'alder dot test',
        'https://alder.test?x=1',
      ],
    });
    expect(bad.status).toBe(400);
    expect((await bad.json()).fields).toEqual({
      'embedOrigins.1': '“HTTPS://WWW.ALDER.TEST” is the same site as entry 1.',
      'embedOrigins.2': '“https://alder.test/contact” must be the site only, with no path after the host.',
      'embedOrigins.3': '“ftp://alder.test” must start with https:// (or http://).',
      'embedOrigins.4': '“alder dot test” is not a web address; write it like https://www.example.com.',
      'embedOrigins.5': '“https://alder.test?x=1” must be the site only, with no path after the host.',
    });
    // Origins are written as the URL standard serialises them (WHATWG URL, "origin"): scheme and host lower-case, default port dropped.
    const saved = await put(widgetRoute, f.owner, '/api/app/settings/widget', { embedOrigins: ['HTTPS://Www.Alder.test:443/', 'http://localhost:8080'] });
    expect(await saved.json()).toEqual({ embedOrigins: ['https://www.alder.test', 'http://localhost:8080'] });
  });

  test('a saved list applies to the next widget request at once: framing and CORS', async () => {
    const f = await firm();
    const before = await companyBySlug(em(), f.company.slug);
    expect(frameAncestors(before)).toBe("'self'");
    expect(allowedOrigin('https://www.alder.test', before)).toBeNull();
    await put(widgetRoute, f.owner, '/api/app/settings/widget', { embedOrigins: ['https://www.alder.test'] });
    const after = await companyBySlug(em(), f.company.slug);
    expect(frameAncestors(after)).toBe("'self' https://www.alder.test");
    expect(allowedOrigin('https://www.alder.test', after)).toBe('https://www.alder.test');
    await put(widgetRoute, f.owner, '/api/app/settings/widget', { embedOrigins: [] });
    expect(allowedOrigin('https://www.alder.test', await companyBySlug(em(), f.company.slug))).toBeNull();
  });
});

describe('the service area', () => {
  test('a radius needs the office’s ZIP code; then postcodes are in or out by distance, and the triage rule follows', async () => {
    const f = await firm();
    const noOffice = await put(serviceAreaRoute, f.owner, '/api/app/settings/service-area', { kind: 'radius', radiusMiles: 10 });
    expect(noOffice.status).toBe(400);
    expect((await noOffice.json()).fields.radiusMiles).toContain('firm profile');
    await put(profileRoute, f.owner, '/api/app/settings/profile', goodProfile); // office in 78701, downtown Austin
    const saved = await put(serviceAreaRoute, f.owner, '/api/app/settings/service-area', { kind: 'radius', radiusMiles: 10 });
    expect(await saved.json()).toEqual({ kind: 'radius', radiusMiles: 10 });
    const company = await reload(f.company.id);
    // ZIP centroids from the zipcodes package: 78759 (north Austin) lies about 9 miles from 78701,
    // 78666 (San Marcos) about 27 and 10001 (Manhattan) some 1,500. Source: zipcodes 8.0.0 `distance`.
    expect(servesPostcode(company, '78759')).toBe(true);
    expect(servesPostcode(company, '78666')).toBe(false);
    expect(servesPostcode(company, '10001')).toBe(false);
    // A ZIP code we cannot place is outside a radius.
    expect(servesPostcode(company, '00000')).toBe(false);
    // And the office cannot move to a ZIP code the radius could not be measured from.
    const lost = await put(profileRoute, f.owner, '/api/app/settings/profile', { ...goodProfile, addressPostcode: '00000' });
    expect((await lost.json()).fields.addressPostcode).toContain('cannot place');
  });

  test('a list keeps its entries once each; a bad entry is named by its position', async () => {
    const f = await firm();
    const saved = await put(serviceAreaRoute, f.owner, '/api/app/settings/service-area', { kind: 'postcodes', postcodes: ['787', ' 787 ', '78666'] });
    expect(await saved.json()).toEqual({ kind: 'postcodes', postcodes: ['787', '78666'] });
    const company = await reload(f.company.id);
    expect([servesPostcode(company, '78704'), servesPostcode(company, '78666'), servesPostcode(company, '10001')]).toEqual([true, true, false]);
    const bad = await put(serviceAreaRoute, f.owner, '/api/app/settings/service-area', { kind: 'postcodes', postcodes: ['787', '7 8!'] });
    expect((await bad.json()).fields).toEqual({ 'postcodes.1': 'Use a ZIP or postcode, or its first characters, like 787.' });
    const neither = await put(serviceAreaRoute, f.owner, '/api/app/settings/service-area', { kind: 'circle' });
    expect((await neither.json()).fields).toEqual({ kind: 'Choose a list of postcodes or a distance from your office.' });
  });
});

describe('notifications', () => {
  test('further addresses get new-inquiry e-mails beside the team (once each, never to someone who turned them off)', async () => {
    const f = await firm();
    f.members[1]!.membership.newInquiryMail = false;
    await f.owner.em.upsert(f.members[1]!.membership);
    const saved = await put(notificationsRoute, f.owner, '/api/app/settings/notifications', {
      extraEmails: ['Desk@Alder.test', 'desk@alder.test', f.members[0]!.email, f.members[1]!.email],
      responseTargetMinutes: 90,
    });
    expect(await saved.json()).toEqual({ extraEmails: ['desk@alder.test', f.members[0]!.email, f.members[1]!.email], responseTargetMinutes: 90 });
    expect((await newInquiryRecipients(em(), f.company.id)).sort()).toEqual(['desk@alder.test', f.members[0]!.email].sort());
    expect((await reload(f.company.id)).responseTargetMinutes).toBe(90);
  });

  test('a bad address is named by its position; the target must be whole minutes within a working week', async () => {
    const f = await firm();
    const bad = await put(notificationsRoute, f.owner, '/api/app/settings/notifications', {
      extraEmails: ['desk@alder.test', 'desk'],
      responseTargetMinutes: 5000,
    });
    expect((await bad.json()).fields).toEqual({
      'extraEmails.1': 'Enter an e-mail address like office@example.com.',
      responseTargetMinutes: 'At most a working week (2,700 minutes).',
    });
  });
});

describe('no body gives a 500', () => {
  // Bodies built from the fields' own names with values of any JSON shape, plus plain garbage.
  const json = fc.jsonValue({ maxDepth: 2 });
  const bodyFor = (keys: string[]) =>
    fc.oneof(
      fc.dictionary(fc.constantFrom(...keys, 'kind', 'extra'), json, { maxKeys: keys.length + 2 }),
      json,
      fc.string().map((text) => `{${text}`),
    );
  const cases = [
    { route: profileRoute, path: '/api/app/settings/profile', keys: Object.keys(goodProfile) },
    { route: serviceAreaRoute, path: '/api/app/settings/service-area', keys: ['kind', 'postcodes', 'radiusMiles'] },
    { route: notificationsRoute, path: '/api/app/settings/notifications', keys: ['extraEmails', 'responseTargetMinutes'] },
    { route: widgetRoute, path: '/api/app/settings/widget', keys: ['embedOrigins'] },
  ];
  let owner: StaffCaller;
  beforeAll(async () => {
    owner = (await firm()).owner;
  });
  for (const { route, path, keys } of cases) {
    fcTest.prop([bodyFor(keys)], { numRuns: 60, seed: 20261204 })(`PUT ${path}`, async (body) => {
      const answer = await put(route, owner, path, typeof body === 'string' ? body : body);
      expect([200, 400], JSON.stringify(body)).toContain(answer.status);
    });
  }
  fcTest.prop([fc.array(fc.webUrl({ withQueryParameters: true, withFragments: true }), { maxLength: 4 })], { numRuns: 60, seed: 20261204 })(
    'generated web addresses as allowed sites',
    async (sites) => {
      const answer = await put(widgetRoute, owner, '/api/app/settings/widget', { embedOrigins: sites });
      expect([200, 400]).toContain(answer.status);
      if (answer.status === 200) for (const origin of (await answer.json()).embedOrigins) expect(new URL(origin).origin).toBe(origin);
    },
  );
});
