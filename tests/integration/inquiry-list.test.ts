import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { APIRoute } from 'astro';
import type { MikroORM } from '@mikro-orm/postgresql';
import { getOrm } from '../../src/lib/server/boot/orm';
import type { Company } from '../../src/lib/server/companies/company.entity';
import type { Lead } from '../../src/lib/server/leads/lead.entity';
import { neighboursInList, listViewerOf } from '../../src/lib/server/leads/inquiry-list';
import type { Membership } from '../../src/lib/server/users/membership.entity';
import type { User } from '../../src/lib/server/users/user.entity';
import { inquiryListQuerySchema, type InquiryListPage } from '../../src/lib/shared/inquiry-list';
import * as listRoute from '../../src/pages/api/app/leads/index';
import * as exportRoute from '../../src/pages/api/app/leads/export';
import * as columnsRoute from '../../src/pages/api/app/me/list-columns';
import { buildFirm } from '../helpers/accounts';
import { buildLead, buildRateBookVersion } from '../helpers/factories';

let orm: MikroORM;
const em = () => orm.em.fork();

type Person = { user: User; membership: Membership; company: Company };

/** Calls a staff route in-process as `who` (or signed out), with a real Request. */
async function call(route: APIRoute, who: Person | null, path: string, init: { method?: string; body?: unknown } = {}): Promise<Response> {
  const url = new URL(path, 'http://127.0.0.1:4321');
  const request = new Request(url, {
    method: init.method ?? 'GET',
    headers: { 'content-type': 'application/json' },
    body: init.body === undefined ? undefined : JSON.stringify(init.body),
  });
  const membership = who && {
    id: who.membership.id,
    companyId: who.company.id,
    companyName: who.company.name,
    companySlug: who.company.slug,
    role: who.membership.role,
  };
  const locals = who
    ? {
        em: em(),
        user: { id: who.user.id, email: who.user.email, name: who.user.name },
        session: { token: 'test', expiresAt: new Date(Date.now() + 3_600_000), absoluteExpiresAt: new Date(Date.now() + 3_600_000) },
        membership,
        memberships: [membership],
      }
    : { em: em() };
  return route({ request, url, params: {}, locals } as unknown as Parameters<APIRoute>[0]);
}

const list = async (who: Person, qs: string) => {
  const response = await call(listRoute.GET, who, `/api/app/leads?${qs}`);
  expect(response.status, await response.clone().text()).toBe(200);
  return (await response.json()) as InquiryListPage;
};

/** Every row of a view, following the cursors. */
async function everyRow(who: Person, qs: string): Promise<string[]> {
  const ids: string[] = [];
  let after: string | null = null;
  for (let page = 0; page < 20; page++) {
    const body = await list(who, `${qs}${after ? `&after=${after}` : ''}`);
    ids.push(...body.rows.map((r) => r.id));
    after = body.nextCursor;
    if (!after) break;
  }
  return ids;
}

let owner: Person;
let sales: Person;
let otherOwner: Person;
const leads: Lead[] = [];
const TIE = new Date('2026-11-20T15:00:00Z');

beforeAll(async () => {
  orm = await getOrm();
  const setup = em();
  const firm = await buildFirm(setup, [
    { name: 'Olwen', role: 'owner' },
    { name: 'Sefton', role: 'sales' },
  ]);
  const other = await buildFirm(setup, [{ name: 'Nadia', role: 'owner' }]);
  owner = { ...firm.members[0]!, company: firm.company };
  sales = { ...firm.members[1]!, company: firm.company };
  otherOwner = { ...other.members[0]!, company: other.company };

  const version = buildRateBookVersion(setup, firm.company.id, { status: 'published' });
  // 32 leads: 12 arrive at the very same moment (ties on "received"), names repeat (ties on "name").
  for (let i = 0; i < 32; i++) {
    const createdAt = i < 12 ? TIE : new Date(TIE.getTime() - (i + 1) * 3_600_000);
    const lead = buildLead(setup, firm.company.id, { name: `Homeowner ${i % 5}`, createdAt, rateBookVersion: version });
    lead.phone = `+1512555${String(1000 + i).padStart(4, '0')}`;
    // A firm loaded in this EntityManager gets its due time from its target; these are not due yet.
    lead.responseDueAt = new Date('2099-01-01T00:00:00Z');
    leads.push(lead);
  }
  leads[0]!.stage = 'spoken-to';
  leads[1]!.stage = 'spoken-to';
  leads[2]!.stage = 'going-ahead';
  leads[3]!.assignee = sales.membership;
  leads[4]!.name = '=HYPERLINK("http://x.test","Click")';
  // Due in the past with no first contact: overdue, unless the inquiry has ended.
  leads[5]!.responseDueAt = new Date('2026-11-01T00:00:00Z');
  leads[2]!.responseDueAt = new Date('2026-11-01T00:00:00Z');
  leads[6]!.responseDueAt = new Date('2026-11-01T00:00:00Z');
  leads[6]!.firstContactAt = new Date('2026-10-31T00:00:00Z');
  leads[7]!.deletedAt = new Date();
  // The other firm's lead carries a phone of the first firm's, so a search must not cross firms.
  const foreign = buildLead(setup, other.company.id, { name: 'Foreign Homeowner' });
  foreign.phone = '+15125551010';
  await setup.flush();
});

afterAll(async () => {
  await orm.close();
});

describe('GET /api/app/leads', () => {
  test('signed out: 401 JSON', async () => {
    const response = await call(listRoute.GET, null, '/api/app/leads');
    expect(response.status).toBe(401);
    expect(await response.json()).toHaveProperty('error');
  });

  test('bad parameters get field-level messages, never a 500', async () => {
    const response = await call(listRoute.GET, sales, '/api/app/leads?stage=new,won&limit=7&sort=colour&from=2026-13&overdue=yes&bogus=1');
    expect(response.status).toBe(400);
    const body = await response.json();
    expect(Object.keys(body.fields).sort()).toEqual(['bogus', 'from', 'limit', 'overdue', 'sort', 'stage.1']);
  });

  test('a date range that ends before it starts names the end', async () => {
    const response = await call(listRoute.GET, sales, '/api/app/leads?from=2026-11-20&to=2026-11-01');
    expect(response.status).toBe(400);
    expect((await response.json()).fields).toEqual({ to: 'The end is before the start.' });
  });

  test('a cursor that is not ours, or from another sort, is refused by field', async () => {
    const first = await list(sales, 'sort=name');
    for (const qs of ['after=garbage', `sort=score&after=${first.nextCursor}`]) {
      const response = await call(listRoute.GET, sales, `/api/app/leads?${qs}`);
      expect(response.status).toBe(400);
      expect(Object.keys((await response.json()).fields)).toEqual(['after']);
    }
  });

  test('keyset paging returns every listed inquiry exactly once, with ties on the sort key, in every sort', async () => {
    const listed = leads.filter((l) => !l.deletedAt).map((l) => l.id);
    for (const qs of [
      'sort=received&dir=desc',
      'sort=received&dir=asc',
      'sort=name',
      'sort=stage&dir=desc',
      'sort=assignee',
      'sort=followUp',
      'sort=waiting',
    ]) {
      const ids = await everyRow(sales, qs);
      expect(ids.length, qs).toBe(listed.length);
      expect(new Set(ids), qs).toEqual(new Set(listed));
    }
  });

  test('the first page of the newest comes first, ties broken the same way every time', async () => {
    const a = await list(sales, '');
    const b = await list(sales, 'sort=received&dir=desc');
    expect(a.rows.map((r) => r.id)).toEqual(b.rows.map((r) => r.id));
    expect(a.rows).toHaveLength(25);
    expect(a.rows.slice(0, 11).every((r) => r.receivedAt === TIE.toISOString())).toBe(true);
  });

  test('counts per stage follow the filters and search but not the stage picked', async () => {
    const body = await list(sales, 'stage=spoken-to');
    expect(body.rows.map((r) => r.id).sort()).toEqual([leads[0]!.id, leads[1]!.id].sort());
    expect(body.counts['spoken-to']).toBe(2);
    expect(body.counts['going-ahead']).toBe(1);
    expect(body.counts.new).toBe(28); // 32, less 3 moved on, less 1 deleted
    const searched = await list(sales, `stage=spoken-to&q=${encodeURIComponent('512 555 1000')}`);
    expect(searched.rows.map((r) => r.id)).toEqual([leads[0]!.id]);
    expect(searched.counts).toMatchObject({ new: 0, 'spoken-to': 1, 'going-ahead': 0 });
  });

  test('search by a phone typed with spaces or brackets finds that inquiry, only in the viewer’s firm', async () => {
    for (const typed of ['512 555 1010', '(512) 555-1010', '+1 512-555-1010']) {
      const body = await list(sales, `q=${encodeURIComponent(typed)}`);
      expect(
        body.rows.map((r) => r.id),
        typed,
      ).toEqual([leads[10]!.id]);
    }
    const foreign = await list(otherOwner, `q=${encodeURIComponent('512 555 1010')}`);
    expect(foreign.rows.map((r) => r.name)).toEqual(['Foreign Homeowner']);
  });

  test('overdue: no first contact and past due, not for an ended inquiry; filter and flag agree', async () => {
    const body = await list(sales, 'overdue=1');
    expect(body.rows.map((r) => r.id)).toEqual([leads[5]!.id]);
    expect(body.rows[0]!.overdue).toBe(true);
  });

  test('assignee filters: mine, unassigned, a teammate; the other firm’s ids find nothing', async () => {
    expect((await list(sales, 'assignee=mine')).rows.map((r) => r.id)).toEqual([leads[3]!.id]);
    expect((await list(sales, `assignee=${sales.membership.id}`)).rows.map((r) => r.assigneeName)).toEqual(['Sefton']);
    expect((await everyRow(sales, 'assignee=unassigned')).length).toBe(30);
    expect((await list(otherOwner, `assignee=${sales.membership.id}`)).rows).toEqual([]);
  });

  test('another firm’s staff never see this firm’s inquiries, and deleted ones are never listed', async () => {
    const body = await list(otherOwner, '');
    expect(body.rows.map((r) => r.name)).toEqual(['Foreign Homeowner']);
    expect(await everyRow(owner, '')).not.toContain(leads[7]!.id);
  });

  test('unread until opened; each row carries the phone for a call', async () => {
    const body = await list(sales, 'q=homeowner 1&sort=name');
    expect(body.rows.every((r) => r.unread)).toBe(true);
    expect(body.rows[0]!.phone).toMatch(/^\+1512555\d{4}$/);
  });
});

describe('previous and next on the inquiry page', () => {
  test('are the rows before and after in the list’s order', async () => {
    const qs = 'sort=name';
    const ordered = await everyRow(sales, qs);
    const viewer = await listViewerOf(em(), { companyId: sales.company.id, membership: sales.membership });
    const query = inquiryListQuerySchema.parse({ sort: 'name' });
    const middle = await neighboursInList(em(), viewer, query, ordered[10]!);
    expect(middle.previous?.id).toBe(ordered[9]);
    expect(middle.next?.id).toBe(ordered[11]);
    const first = await neighboursInList(em(), viewer, query, ordered[0]!);
    expect(first.previous).toBeNull();
    const other = await neighboursInList(
      em(),
      await listViewerOf(em(), { companyId: otherOwner.company.id, membership: otherOwner.membership }),
      query,
      ordered[10]!,
    );
    expect(other).toEqual({ previous: null, next: null });
  });
});

describe('GET /api/app/leads/export', () => {
  test('sales may not export (403); the other firm’s owner gets only their own rows', async () => {
    expect((await call(exportRoute.GET, sales, '/api/app/leads/export')).status).toBe(403);
    const text = await (await call(exportRoute.GET, otherOwner, '/api/app/leads/export')).text();
    expect(text.trim().split('\n')).toHaveLength(2);
    expect(text).toContain('Foreign Homeowner');
  });

  test('owners get the filtered view as CSV, a formula in a name written as text', async () => {
    const response = await call(exportRoute.GET, owner, '/api/app/leads/export?sort=name&limit=25');
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toBe('text/csv; charset=utf-8');
    const lines = (await response.text()).trim().split('\n');
    expect(lines[0]).toMatch(/^Reference,Homeowner,Phone,/);
    expect(lines).toHaveLength(1 + 31);
    // Source: OWASP "CSV Injection" — the leading apostrophe; RFC 4180 §2 — the quoting.
    expect(lines.some((l) => l.includes(`,"'=HYPERLINK(""http://x.test"",""Click"")",`))).toBe(true);
    const bad = await call(exportRoute.GET, owner, '/api/app/leads/export?stage=won');
    expect(bad.status).toBe(400);
    expect((await bad.json()).fields).toHaveProperty('stage.0');
  });
});

describe('/api/app/me/list-columns', () => {
  test('all columns until a choice; a choice is kept per person in list order', async () => {
    const before = await (await call(columnsRoute.GET, sales, '/api/app/me/list-columns')).json();
    expect(before.columns).toContain('score');
    const saved = await call(columnsRoute.PUT, sales, '/api/app/me/list-columns', { method: 'PUT', body: { columns: ['stage', 'name', 'reference'] } });
    expect(await saved.json()).toEqual({ columns: ['reference', 'name', 'stage'] });
    expect((await (await call(columnsRoute.GET, sales, '/api/app/me/list-columns')).json()).columns).toEqual(['reference', 'name', 'stage']);
    expect((await (await call(columnsRoute.GET, owner, '/api/app/me/list-columns')).json()).columns).toHaveLength(12);
  });

  test('bad choices get field-level messages', async () => {
    for (const [body, field] of [
      [{ columns: [] }, 'columns'],
      [{ columns: ['name', 'colour'] }, 'columns.1'],
      [{ columns: ['name', 'name'] }, 'columns'],
      [{ columns: ['name'], extra: 1 }, 'extra'],
    ] as const) {
      const response = await call(columnsRoute.PUT, sales, '/api/app/me/list-columns', { method: 'PUT', body });
      expect(response.status).toBe(400);
      expect(Object.keys((await response.json()).fields)).toEqual([field]);
    }
  });
});
