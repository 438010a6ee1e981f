import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { fc, test as fcTest } from '@fast-check/vitest';
import type { APIRoute } from 'astro';
import type { MikroORM } from '@mikro-orm/postgresql';
import { getOrm } from '../../src/lib/server/boot/orm';
import { Company } from '../../src/lib/server/companies/company.entity';
import { estimateForFirm } from '../../src/lib/server/estimates/estimate.service';
import { Lead } from '../../src/lib/server/leads/lead.entity';
import { RateBookVersion } from '../../src/lib/server/rates/rate-book-version.entity';
import { storedRateBook } from '../../src/lib/server/rates/stored-rate-book';
import { previewSamples } from '../../src/lib/server/rate-preview/draft-preview';
import { projectSchema, sampleProject, sampleRateBook, type RateBookInput } from '../../src/lib/estimate';
import * as ratesRoute from '../../src/pages/api/app/rates/index';
import * as compareRoute from '../../src/pages/api/app/rates/compare';
import * as draftRoute from '../../src/pages/api/app/rates/draft/index';
import * as publishRoute from '../../src/pages/api/app/rates/draft/publish';
import * as previewRoute from '../../src/pages/api/app/rates/draft/preview';
import * as replayRoute from '../../src/pages/api/app/rates/draft/replay/index';
import * as replayOneRoute from '../../src/pages/api/app/rates/draft/replay/[id]';
import { buildFirm } from '../helpers/accounts';
import { callAsStaff, type StaffCaller } from '../helpers/as-staff';
import { buildLead } from '../helpers/factories';

// The Rate book's routes with a real PostgreSQL: estimates given before a publish keep their
// numbers, a version stored in an older shape still loads, sales staff are told of none of it
// (404), and no body, however malformed, gets a 500.

let orm: MikroORM;
beforeAll(async () => {
  orm = await getOrm();
});
afterAll(async () => {
  await orm.close();
});
const em = () => orm.em.fork();

/** A firm with an owner and a salesperson, and `stored` (an envelope as the column holds it) published as version 1. */
async function firm(stored: unknown = storedRateBook.wrap(sampleRateBook())) {
  const built = await buildFirm(em(), [
    { name: 'Odile', role: 'owner' },
    { name: 'Saul', role: 'sales' },
  ]);
  const fork = em();
  const published = fork.create(RateBookVersion, {
    company: built.company.id,
    number: 1,
    status: 'published',
    data: stored as never,
    publishedAt: new Date(),
  });
  await fork.flush();
  const as = (index: number): StaffCaller => ({ company: built.company, user: built.members[index]!.user, membership: built.members[index]!.membership });
  return { ...built, published, owner: as(0), sales: as(1) };
}

const call = (route: APIRoute, as: StaffCaller, method: string, path: string, body?: unknown, params?: Record<string, string>) =>
  callAsStaff(route, as, { em: em(), method, path, body, params });

async function draftOf(as: StaffCaller): Promise<{ revision: number; data: RateBookInput }> {
  const opened = await call(draftRoute.POST, as, 'POST', '/api/app/rates/draft', {});
  expect([200, 201]).toContain(opened.status);
  return opened.json();
}

describe('publishing', () => {
  test('an estimate given before a publish keeps its numbers and version; estimates after it use the new one', async () => {
    const f = await firm();
    const fork = em();
    const lead = buildLead(fork, f.company.id, { rateBookVersion: fork.getReference(RateBookVersion, f.published.id) });
    await fork.flush();
    const kept = await em().findOneOrFail(Lead, { id: lead.id }, { populate: ['estimate'] });
    const company = await em().findOneOrFail(Company, { id: f.company.id });
    const before = await estimateForFirm(em(), company, projectSchema.parse(sampleProject()));

    const draft = await draftOf(f.owner);
    const raised = { ...draft.data, labour: { ...draft.data.labour, rateCents: draft.data.labour.rateCents * 2 } };
    const saved = await call(draftRoute.PUT, f.owner, 'PUT', '/api/app/rates/draft', { revision: draft.revision, data: raised });
    expect(saved.status).toBe(200);
    const published = await call(publishRoute.POST, f.owner, 'POST', '/api/app/rates/draft/publish', { revision: (await saved.json()).revision });
    expect(published.status).toBe(200);
    expect(await published.json()).toMatchObject({ number: 2, status: 'published', publishedBy: 'Odile' });

    const after = await estimateForFirm(em(), company, projectSchema.parse(sampleProject()));
    expect(after.version.number).toBe(2);
    expect(after.result.price.lowCents).toBeGreaterThan(before.result.price.lowCents);
    const reread = await em().findOneOrFail(Lead, { id: lead.id }, { populate: ['estimate'] });
    expect([reread.rangeLowCents, reread.rangeHighCents, reread.rateBookVersion.id]).toEqual([kept.rangeLowCents, kept.rangeHighCents, f.published.id]);
    expect(reread.estimate).toEqual(kept.estimate);
  });

  test('a save or a publish from an older revision is refused with 409, and nothing is published', async () => {
    const f = await firm();
    const draft = await draftOf(f.owner);
    const first = await call(draftRoute.PUT, f.owner, 'PUT', '/api/app/rates/draft', { revision: draft.revision, data: { ...draft.data, taxRate: 0.05 } });
    expect(first.status).toBe(200);
    const stale = await call(publishRoute.POST, f.owner, 'POST', '/api/app/rates/draft/publish', { revision: draft.revision });
    expect(stale.status).toBe(409);
    expect((await stale.json()).error).toBeTruthy();
    const overview = await (await call(ratesRoute.GET, f.owner, 'GET', '/api/app/rates')).json();
    expect(overview.published.number).toBe(1);
  });
});

describe('a version stored before the newer fields', () => {
  // The sample Rate book exactly as a version-1 envelope held it on 2 December 2026, before
  // fixtures, coats, casings, damp-rated stock and the rest were added (each with a default).
  const stored = JSON.parse(readFileSync('tests/fixtures/rate-book-version-1-as-stored-2026-12-02.json', 'utf8'));

  test('still loads, prices, previews and opens as a draft that saves', async () => {
    expect(() => storedRateBook.read(stored)).not.toThrow();
    const f = await firm(stored);
    const company = await em().findOneOrFail(Company, { id: f.company.id });
    const priced = await estimateForFirm(em(), company, projectSchema.parse(sampleProject()));
    expect(priced.result.price.lowCents).toBeGreaterThan(0);
    const draft = await draftOf(f.owner);
    expect(draft.data.labour.rateCents).toBe(stored.data.labour.rateCents);
    const preview = await previewSamples(em(), f.company.id);
    expect(preview.rooms.length).toBeGreaterThan(0);
    for (const room of preview.rooms) expect(room.published).toEqual(room.draft);
    const saved = await call(draftRoute.PUT, f.owner, 'PUT', '/api/app/rates/draft', { revision: draft.revision, data: draft.data });
    expect(saved.status).toBe(200);
  });
});

describe('who may see the Rate book', () => {
  test('sales get 404 from every route, the owner does not', async () => {
    const f = await firm();
    const draft = await draftOf(f.owner);
    const replay = await (await call(replayRoute.POST, f.owner, 'POST', '/api/app/rates/draft/replay')).json();
    const routes: [APIRoute, string, string, unknown?, Record<string, string>?][] = [
      [ratesRoute.GET, 'GET', '/api/app/rates'],
      [compareRoute.GET, 'GET', `/api/app/rates/compare?before=${f.published.id}&after=${f.published.id}`],
      [draftRoute.POST, 'POST', '/api/app/rates/draft', {}],
      [draftRoute.PUT, 'PUT', '/api/app/rates/draft', { revision: draft.revision, data: draft.data }],
      [previewRoute.GET, 'GET', '/api/app/rates/draft/preview'],
      [replayRoute.POST, 'POST', '/api/app/rates/draft/replay'],
      [replayOneRoute.GET, 'GET', `/api/app/rates/draft/replay/${replay.id}`, undefined, { id: replay.id }],
      [publishRoute.POST, 'POST', '/api/app/rates/draft/publish', { revision: 999 }],
      [draftRoute.DELETE, 'DELETE', '/api/app/rates/draft', { revision: 999 }],
    ];
    for (const [route, method, path, body, params] of routes) {
      const refused = await call(route, f.sales, method, path, body, params);
      expect(refused.status, `${method} ${path}`).toBe(404);
      expect(JSON.stringify(await refused.json())).not.toContain('rateCents');
    }
    for (const [route, method, path, body, params] of routes.slice(0, 7)) {
      expect((await call(route, f.owner, method, path, body, params)).status, `${method} ${path}`).toBeLessThan(300);
    }
  });
});

describe('no body gives a 500', () => {
  // One field of a good draft replaced by a value of any JSON shape: a save is 200 or a 400 naming fields.
  type Leaf = { path: (string | number)[] };
  const leavesOf = (value: unknown, path: (string | number)[] = []): Leaf[] =>
    value !== null && typeof value === 'object'
      ? Object.entries(value).flatMap(([key, inner]) => leavesOf(inner, [...path, Array.isArray(value) ? Number(key) : key]))
      : [{ path }];
  const withValueAt = (data: unknown, path: (string | number)[], value: unknown): unknown => {
    const copy = structuredClone(data) as Record<string | number, unknown>;
    let at = copy;
    for (const key of path.slice(0, -1)) at = at[key] as Record<string | number, unknown>;
    at[path[path.length - 1]!] = value;
    return copy;
  };
  const sample = sampleRateBook();
  const leaves = leavesOf(sample);
  let owner: StaffCaller;
  // A firm with no draft for bodies of any shape: a body that happened to name the right revision
  // could otherwise discard or publish the draft the other property saves to.
  let ownerWithoutDraft: StaffCaller;
  let revision = 0;
  beforeAll(async () => {
    const f = await firm(storedRateBook.wrap(sample));
    owner = f.owner;
    revision = (await draftOf(owner)).revision;
    ownerWithoutDraft = (await firm()).owner;
  });

  fcTest.prop([fc.constantFrom(...leaves), fc.jsonValue({ maxDepth: 2 })], { numRuns: 80, seed: 20261204 })(
    'PUT /api/app/rates/draft with one field changed',
    async (leaf, value) => {
      const answer = await call(draftRoute.PUT, owner, 'PUT', '/api/app/rates/draft', { revision, data: withValueAt(sample, leaf.path, value) });
      const body = await answer.json();
      expect([200, 400], JSON.stringify({ at: leaf.path, value, body })).toContain(answer.status);
      if (answer.status === 200) revision = body.revision;
      else expect(Object.keys(body.fields ?? {}).length, JSON.stringify(body)).toBeGreaterThan(0);
    },
  );

  const json = fc.jsonValue({ maxDepth: 2 });
  fcTest.prop(
    [
      fc.oneof(
        fc.dictionary(fc.constantFrom('revision', 'data', 'note', 'fromVersionId', 'extra'), json, { maxKeys: 4 }),
        json,
        fc.string().map((t) => `{${t}`),
      ),
    ],
    {
      numRuns: 60,
      seed: 20261204,
    },
  )('any body on every Rate book route', async (body) => {
    for (const [route, method, path] of [
      [draftRoute.PUT, 'PUT', '/api/app/rates/draft'],
      [draftRoute.DELETE, 'DELETE', '/api/app/rates/draft'],
      [publishRoute.POST, 'POST', '/api/app/rates/draft/publish'],
      [compareRoute.GET, 'GET', `/api/app/rates/compare?before=${encodeURIComponent(JSON.stringify(body)).slice(0, 80)}&after=x`],
    ] as const) {
      const answer = await call(route, ownerWithoutDraft, method, path, method === 'GET' ? undefined : body);
      expect(answer.status, `${method} ${path} ${JSON.stringify(body)}`).toBeLessThan(500);
      expect(answer.status).toBeGreaterThanOrEqual(400);
    }
  });
});
