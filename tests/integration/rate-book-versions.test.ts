import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { UniqueConstraintViolationException } from '@mikro-orm/core';
import type { MikroORM } from '@mikro-orm/postgresql';
import { getOrm } from '../../src/lib/server/boot/orm';
import { buildFirm } from '../helpers/accounts';
import { buildRateBookVersion } from '../helpers/factories';
import { InvalidInput } from '../../src/lib/server/errors';
import { DraftChanged, NoDraft, openDraft, publishDraft, rateBookOverview, saveDraft } from '../../src/lib/server/rates/rate-book-drafts';

let orm: MikroORM;
beforeAll(async () => {
  orm = await getOrm();
});
afterAll(async () => {
  await orm.close();
});

describe('rate book versions', () => {
  test('a firm has at most one published version: the database refuses a second one', async () => {
    const em = orm.em.fork();
    const { company } = await buildFirm(em, []);
    buildRateBookVersion(em, company.id, { status: 'published', number: 1 });
    buildRateBookVersion(em, company.id, { status: 'draft', number: 2 });
    await em.flush();

    const racing = orm.em.fork();
    buildRateBookVersion(racing, company.id, { status: 'published', number: 3 });
    await expect(racing.flush()).rejects.toBeInstanceOf(UniqueConstraintViolationException);
  });
});

describe('drafts and publishing', () => {
  test('a published version never changes: the database refuses it, and the draft routes cannot reach it', async () => {
    const em = orm.em.fork();
    const { company, members } = await buildFirm(em, [{ name: 'Olive', role: 'owner' }]);
    const owner = { companyId: company.id, userId: members[0].user.id };
    buildRateBookVersion(em, company.id, { status: 'published', number: 1 });
    await em.flush();

    const { draft } = await openDraft(em.fork(), owner);
    expect(draft.number).toBe(2);
    expect(draft.basedOn).toBe(1);
    const raised = { ...draft.data, labour: { ...draft.data.labour, rateCents: draft.data.labour.rateCents + 1000 } };
    const saved = await saveDraft(em.fork(), owner, { revision: draft.revision, data: raised });
    const published = await publishDraft(em.fork(), owner, { revision: saved.revision, note: 'Labour up $10' });
    expect(published).toMatchObject({ number: 2, status: 'published', publishedBy: 'Olive' });

    await expect(em.fork().getConnection().execute(`update rate_book_version set data = '{}'::jsonb where id = ?`, [published.id])).rejects.toThrow(
      /never change/,
    );
    // Saving over a draft that was published finds no draft: nothing changes.
    await expect(saveDraft(em.fork(), owner, { revision: saved.revision, data: raised })).rejects.toBeInstanceOf(NoDraft);
    const overview = await rateBookOverview(em.fork(), company.id);
    expect(overview.versions.map((v) => [v.number, v.status])).toEqual([
      [2, 'published'],
      [1, 'retired'],
    ]);
  });

  test('two saves from the same revision: one succeeds, the other gets a conflict naming what differs', async () => {
    const em = orm.em.fork();
    const { company, members } = await buildFirm(em, [
      { name: 'Olive', role: 'owner' },
      { name: 'Otto', role: 'owner' },
    ]);
    buildRateBookVersion(em, company.id, { status: 'published', number: 1 });
    await em.flush();
    const olive = { companyId: company.id, userId: members[0].user.id };
    const otto = { companyId: company.id, userId: members[1].user.id };
    const { draft } = await openDraft(em.fork(), olive);
    const hers = { ...draft.data, minimumJobCents: 120_000 };
    const his = { ...draft.data, taxRate: 0.08 };
    const results = await Promise.allSettled([
      saveDraft(em.fork(), olive, { revision: draft.revision, data: hers }),
      saveDraft(em.fork(), otto, { revision: draft.revision, data: his }),
    ]);
    expect(results.filter((r) => r.status === 'fulfilled')).toHaveLength(1);
    const refused = results.find((r) => r.status === 'rejected') as PromiseRejectedResult;
    expect(refused.reason).toBeInstanceOf(DraftChanged);
    const changed = (refused.reason as DraftChanged).extra!.changed as { path: string }[];
    expect(changed.map((c) => c.path).sort()).toEqual(['minimumJobCents', 'taxRate']);
  });

  test('bad numbers are refused field by field and nothing is saved', async () => {
    const em = orm.em.fork();
    const { company, members } = await buildFirm(em, [{ name: 'Olive', role: 'owner' }]);
    const owner = { companyId: company.id, userId: members[0].user.id };
    const { draft } = await openDraft(em.fork(), owner);
    const bad = { ...draft.data, materialMarkup: 100, labour: { ...draft.data.labour, rateCents: -5 } };
    const error = await saveDraft(em.fork(), owner, { revision: draft.revision, data: bad }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(InvalidInput);
    expect((error as InvalidInput).fields).toMatchObject({
      materialMarkup: expect.stringContaining('at most 3'),
      'labour.rateCents': expect.stringContaining('cannot be negative'),
    });
    expect((await rateBookOverview(em.fork(), company.id)).draft?.revision).toBe(draft.revision);
  });
});
