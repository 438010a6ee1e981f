import { afterAll, afterEach, beforeAll, describe, expect, test } from 'vitest';
import type { MikroORM } from '@mikro-orm/postgresql';
import { sampleRateBook } from '../../src/lib/estimate';
import { getOrm } from '../../src/lib/server/boot/orm';
import { OutboxMail } from '../../src/lib/server/mail/outbox-mail.entity';
import { firmFormats } from '../../src/lib/server/rates/firm-formats';
import { inviteToTeam } from '../../src/lib/server/team/team.service';
import { buildFirm } from '../helpers/accounts';
import { useFakeClock } from '../helpers/fake-clock';
import { buildLead, buildRateBookVersion } from '../helpers/factories';
import { renderStaffPage, textOf } from '../helpers/staff-pages';

let orm: MikroORM;
beforeAll(async () => {
  orm = await getOrm();
});
afterAll(async () => {
  await orm.close();
});
const em = () => orm.em.fork();

let restoreClock: (() => void) | undefined;
afterEach(() => {
  restoreClock?.();
  restoreClock = undefined;
});

/** A firm with one owner and a published rate book (imperial unless said), and one lead. */
async function firmWithLead(options: { timeZone: string; units?: 'imperial' | 'metric'; leadAt: string }) {
  const setup = em();
  const { company, members } = await buildFirm(setup, [{ name: 'Ola', role: 'owner' }], { timeZone: options.timeZone });
  const rates = { ...sampleRateBook(), units: options.units ?? 'imperial' };
  const version = buildRateBookVersion(setup, company.id, { status: 'published', rates });
  const lead = buildLead(setup, company.id, { rateBookVersion: version, rates, createdAt: new Date(options.leadAt) });
  await setup.flush();
  return { company, owner: members[0]!, lead };
}

function as(firm: Awaited<ReturnType<typeof firmWithLead>>) {
  return { em: em(), company: firm.company, user: firm.owner.user, membership: firm.owner.membership };
}

describe('dates on staff pages are in the firm’s time zone', () => {
  test('an inquiry sent at 01:19 UTC on Dec 2 shows as Dec 1 on the list and on its own page, for a firm in Chicago', async () => {
    // Source: IANA tz database, northamerica: America/Chicago is UTC-6 (CST) in December.
    const firm = await firmWithLead({ timeZone: 'America/Chicago', leadAt: '2026-12-02T01:19:00Z' });
    const list = await renderStaffPage('inquiries', as(firm), '/app');
    const page = await renderStaffPage('lead', as(firm), `/app/leads/${firm.lead.id}`, { id: firm.lead.id });

    // The list's received column for that inquiry (the only one of this firm).
    const listed = list.match(/data-testid="lead-received"[^>]*>([^<]+)</)?.[1];
    expect(textOf(list)).toContain(firm.lead.name);
    const received = textOf(page).match(/received (\w{3} \d{1,2}), (\d{4}), (\d{1,2}:\d\d [AP]M)/);
    expect(listed).toBe('Dec 1');
    expect(received?.slice(1)).toEqual(['Dec 1', '2026', '7:19 PM']);
    expect(listed).toBe(received?.[1]);
    // Both pages give machines the same moment, with the firm's offset.
    const stamps = [list, page].map((html) => html.match(/<time datetime="([^"]+)"[^>]*data-testid="lead-received"/i)?.[1]);
    expect(stamps).toEqual(['2026-12-01T19:19:00-06:00', '2026-12-01T19:19:00-06:00']);
  });

  test('the team page and the invitation e-mail give the expiry in the firm’s zone; the e-mail names the zone', async () => {
    const firm = await firmWithLead({ timeZone: 'America/Chicago', leadAt: '2026-11-20T12:00:00Z' });
    // Invited a week before 01:19 UTC on Dec 2, so the link expires at 7:19 PM on Dec 1 in Chicago.
    const clock = useFakeClock('2026-11-25T01:19:00Z');
    restoreClock = clock.restore;
    const email = `guest-${firm.company.slug}@firm.test`;
    const invite = await inviteToTeam(em(), { companyId: firm.company.id, invitedById: firm.owner.user.id, email, role: 'sales' });
    expect(invite.expiresAt).toBe('2026-12-02T01:19:00.000Z');

    const mail = await em().findOneOrFail(OutboxMail, { toAddress: email });
    expect(mail.textBody).toContain('expires on Tue, Dec 1, 2026, 7:19 PM CST.');

    clock.advance(60_000);
    const team = textOf(await renderStaffPage('team', as(firm), '/app/setup/team'));
    expect(team).toContain(`${email} Sales · expires Dec 1, 2026`);
  });
});

describe('lengths and areas on the inquiry page are in the firm’s units', () => {
  test('a metric firm sees millimetres and square metres, an imperial firm inches and square feet', async () => {
    const metric = await firmWithLead({ timeZone: 'Europe/Berlin', units: 'metric', leadAt: '2026-11-30T10:00:00Z' });
    const imperial = await firmWithLead({ timeZone: 'America/Chicago', leadAt: '2026-11-30T10:00:00Z' });
    const metricPage = textOf(await renderStaffPage('lead', as(metric), `/app/leads/${metric.lead.id}`, { id: metric.lead.id }));
    const imperialPage = textOf(await renderStaffPage('lead', as(imperial), `/app/leads/${imperial.lead.id}`, { id: imperial.lead.id }));

    // Source: NIST SP 811 Appendix B, 1 ft² = 0.09290304 m² and 1 in = 25.4 mm exactly.
    const sqFt = Number(imperialPage.match(/([\d.]+) sq ft net/)?.[1]);
    const sqM = Number(metricPage.match(/([\d.]+) m² net/)?.[1]);
    expect(sqFt).toBeGreaterThan(0);
    expect(sqM).toBeCloseTo(sqFt * 0.09290304, 0);
    expect(metricPage).not.toMatch(/sq ft net/);

    const lastInches = imperialPage.match(/boards, last ([\d/ -]+)"/)?.[1];
    const lastMm = Number(metricPage.match(/boards, last (\d+) mm/)?.[1]);
    expect(lastInches).toBeDefined();
    const [whole, fraction] = lastInches!.split('-');
    const inches = Number(whole) + (fraction ? Number(fraction.split('/')[0]) / Number(fraction.split('/')[1]) : 0);
    expect(Math.abs(lastMm - inches * 25.4)).toBeLessThan(25.4 / 16 + 0.5);
    expect(metricPage).not.toMatch(/boards, last [\d.]+ in\b/);
  });

  test('firmFormats reads units, currency and locale from the published rate book and the zone from the firm', async () => {
    const setup = em();
    const { company } = await buildFirm(setup, [], { timeZone: 'Europe/Berlin' });
    buildRateBookVersion(setup, company.id, { status: 'published', rates: { ...sampleRateBook(), units: 'metric', currency: 'EUR', locale: 'de-DE' } });
    await setup.flush();
    const fmt = await firmFormats(em(), company.id);
    expect({ timeZone: fmt.timeZone, units: fmt.units, currency: fmt.currency, locale: fmt.locale }).toEqual({
      timeZone: 'Europe/Berlin',
      units: 'metric',
      currency: 'EUR',
      locale: 'de-DE',
    });
    // Source: NIST SP 811 Appendix B, 1 in = 25.4 mm exactly; 39.5 in = 1003.3 mm.
    expect(fmt.length(39.5)).toBe('1003 mm');
    // Source: CLDR de-DE currency pattern "#,##0.00 ¤" with "." grouping and "," decimals (from memory).
    expect(fmt.money(123456)).toBe('1.234,56\u00a0€');
    // Source: IANA tz database, europe: Europe/Berlin is UTC+1 in winter.
    expect(fmt.date('2026-12-02T01:19:00Z', 'dateTime')).toBe('Dec 2, 2026, 2:19 AM');
  });

  test('a firm that has not published rates yet still gets its dates, in its own zone', async () => {
    const { company } = await buildFirm(em(), [], { timeZone: 'America/Chicago' });
    const fmt = await firmFormats(em(), company);
    expect(fmt.date('2026-12-02T01:19:00Z', 'day')).toBe('Dec 1');
    expect(fmt.units).toBe('imperial');
  });
});
