/**
 * The owner's way of changing prices: one draft per firm, saved with a revision check, published in
 * one transaction, or discarded. Published versions never change (the database refuses it too), so
 * every estimate keeps meaning what it meant when it was made.
 *
 *   const draft = await openDraft(em, staff);                           // a copy of the published version
 *   await saveDraft(em, staff, { revision: draft.revision, data });     // 409 if someone saved in between
 *   await publishDraft(em, staff, { revision: draft.revision + 1 });    // the widget prices with it from now on
 */
import { LockMode, UniqueConstraintViolationException } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import { rateBookSchema, sampleRateBook, type RateBookInput } from '~/lib/estimate';
import { DEFAULT_TRIAGE_WEIGHTS } from '~/lib/estimate/schemas.ts';
import { jsonChanges } from '~/lib/shared/json-changes';
import type { Envelope } from '../db/versioned-json';
import { AppError, InvalidInput, NotFound } from '../errors';
import { fieldsFromZod } from '~/lib/estimate/errors.ts';
import { User } from '../users/user.entity';
import { RateBookVersion, type RateBookStatus } from './rate-book-version.entity';
import { publishedRatesCacheKey } from './rate-book.service';
import { storedRateBook } from './stored-rate-book';

export type RateBookEditor = { companyId: string; userId: string };

export type VersionSummary = {
  id: string;
  number: number;
  status: RateBookStatus;
  note: string | null;
  createdAt: string;
  publishedAt: string | null;
  publishedBy: string | null;
  retiredAt: string | null;
  basedOn: number | null;
};

export type DraftView = {
  id: string;
  number: number;
  revision: number;
  data: RateBookInput;
  note: string | null;
  updatedAt: string;
  updatedBy: string | null;
  basedOn: number | null;
};

/** What the owner sees of a change someone else saved first. */
export type DraftChange = { path: string; mine: unknown; theirs: unknown };

/** The draft moved on since the owner loaded it; the answer carries the stored draft and what differs. */
export class DraftChanged extends AppError {
  constructor(stored: DraftView, changed: DraftChange[]) {
    const who = stored.updatedBy ?? 'Someone';
    super(
      `${who} saved this draft after you opened it (revision ${stored.revision}). Nothing of yours was saved: load their draft, or copy your changes onto it.`,
      409,
    );
    this.extra = { draft: stored, changed };
  }
}

export class NoDraft extends AppError {
  constructor(message = 'There is no draft to change: it was published or discarded. Start a new draft from the published version.') {
    super(message, 409);
  }
}

/** The numbers as the owner typed them (before the schema's defaults and derived sizes). */
function inputOf(envelope: Envelope<RateBookInput>): RateBookInput {
  // A draft or version stored in the current shape is shown as typed; an older one is upgraded.
  if (envelope?.schemaVersion === storedRateBook.version) return envelope.data;
  return storedRateBook.read(envelope) as RateBookInput;
}

function checkedData(data: unknown): RateBookInput {
  const parsed = rateBookSchema.safeParse(data);
  if (!parsed.success) throw new InvalidInput('Some numbers need attention before the draft can be saved.', fieldsFromZod(parsed.error));
  return data as RateBookInput;
}

const nameOf = (user: User | null): string | null => user?.name ?? null;

function summaryOf(version: RateBookVersion): VersionSummary {
  return {
    id: version.id,
    number: version.number,
    status: version.status,
    note: version.note,
    createdAt: version.createdAt.toISOString(),
    publishedAt: version.publishedAt?.toISOString() ?? null,
    publishedBy: nameOf(version.publishedBy),
    retiredAt: version.retiredAt?.toISOString() ?? null,
    basedOn: version.basedOnNumber,
  };
}

function draftViewOf(version: RateBookVersion): DraftView {
  return {
    id: version.id,
    number: version.number,
    revision: version.revision,
    data: inputOf(version.data),
    note: version.note,
    updatedAt: version.updatedAt.toISOString(),
    updatedBy: nameOf(version.updatedBy),
    basedOn: version.basedOnNumber,
  };
}

const populate = ['publishedBy', 'updatedBy'] as const;

/** Every version of the firm, newest first, with the published one and the draft picked out. */
export async function rateBookOverview(em: EntityManager, companyId: string) {
  const versions = await em.find(RateBookVersion, { company: companyId }, { orderBy: { number: 'desc' }, populate, limit: 200 });
  const draft = versions.find((v) => v.status === 'draft');
  const published = versions.find((v) => v.status === 'published');
  return {
    published: published ? summaryOf(published) : null,
    draft: draft ? draftViewOf(draft) : null,
    versions: versions.map(summaryOf),
  };
}

async function findDraft(em: EntityManager, companyId: string): Promise<RateBookVersion | null> {
  return em.findOne(RateBookVersion, { company: companyId, status: 'draft' }, { populate, refresh: true });
}

/** The firm's draft, or a new one copied from the published version (or from `fromVersionId`). */
export async function openDraft(em: EntityManager, editor: RateBookEditor, fromVersionId?: string): Promise<{ draft: DraftView; created: boolean }> {
  const existing = await findDraft(em, editor.companyId);
  if (existing) return { draft: draftViewOf(existing), created: false };
  const source = fromVersionId
    ? await em.findOne(RateBookVersion, { id: fromVersionId, company: editor.companyId })
    : await em.findOne(RateBookVersion, { company: editor.companyId, status: 'published' });
  if (fromVersionId && !source) throw new NotFound('No such version.');
  const newest = await em.findOne(RateBookVersion, { company: editor.companyId }, { orderBy: { number: 'desc' }, fields: ['number'] });
  const highest = newest?.number ?? 0;
  const fork = em.fork();
  fork.create(RateBookVersion, {
    company: editor.companyId,
    number: highest + 1,
    status: 'draft',
    // A firm that never published starts from the sample numbers, which it must make its own.
    data: storedRateBook.wrap(source ? inputOf(source.data) : sampleRateBook()),
    note: null,
    basedOnNumber: source?.number ?? null,
    createdBy: fork.getReference(User, editor.userId),
    updatedBy: fork.getReference(User, editor.userId),
  });
  try {
    await fork.flush();
  } catch (error) {
    // Another owner opened one at the same moment: theirs is the draft.
    if (!(error instanceof UniqueConstraintViolationException)) throw error;
    const theirs = await findDraft(em, editor.companyId);
    if (!theirs) throw error;
    return { draft: draftViewOf(theirs), created: false };
  }
  return { draft: draftViewOf((await findDraft(em, editor.companyId))!), created: true };
}

/**
 * Saves the owner's numbers over the draft when `revision` is still the stored one, and raises it.
 * A stale revision changes nothing and answers 409 with the stored draft and what differs.
 */
export async function saveDraft(
  em: EntityManager,
  editor: RateBookEditor,
  input: { revision: number; data: unknown; note?: string | null },
): Promise<{ revision: number; updatedAt: string }> {
  const data = checkedData(input.data);
  const updatedAt = new Date();
  const saved = await em.nativeUpdate(
    RateBookVersion,
    { company: editor.companyId, status: 'draft', revision: input.revision },
    {
      data: storedRateBook.wrap(data),
      revision: input.revision + 1,
      updatedBy: editor.userId,
      updatedAt,
      ...(input.note !== undefined ? { note: input.note } : {}),
    },
  );
  if (saved === 1) return { revision: input.revision + 1, updatedAt: updatedAt.toISOString() };
  const stored = await findDraft(em, editor.companyId);
  if (!stored) throw new NoDraft();
  const theirs = draftViewOf(stored);
  throw new DraftChanged(
    theirs,
    jsonChanges(data, theirs.data).map((c) => ({ path: c.path, mine: c.before, theirs: c.after })),
  );
}

/** Throws the draft away (the published version is untouched). */
export async function discardDraft(em: EntityManager, editor: RateBookEditor, input: { revision: number }): Promise<void> {
  const gone = await em.nativeDelete(RateBookVersion, { company: editor.companyId, status: 'draft', revision: input.revision });
  if (gone === 1) return;
  const stored = await findDraft(em, editor.companyId);
  if (!stored) throw new NoDraft('There is no draft to discard.');
  throw new DraftChanged(draftViewOf(stored), []);
}

/**
 * Makes the draft the firm's published version in one transaction: the one published before is
 * retired, and every estimate from now on is priced with the new one. The revision must be the
 * stored one, so an owner publishes exactly what they last saw.
 */
export async function publishDraft(em: EntityManager, editor: RateBookEditor, input: { revision: number; note?: string | null }): Promise<VersionSummary> {
  const published = await em.transactional(async (tx) => {
    // The row lock makes a second publisher wait, then find no draft left.
    const draft = await tx.findOne(RateBookVersion, { company: editor.companyId, status: 'draft' }, { lockMode: LockMode.PESSIMISTIC_WRITE, refresh: true });
    if (!draft) throw new NoDraft('There is no draft to publish: it was published or discarded.');
    if (draft.revision !== input.revision) {
      await tx.populate(draft, ['updatedBy']);
      throw new DraftChanged(draftViewOf(draft), []);
    }
    // Stored numbers that the current schema refuses would fail every estimate: refuse them here.
    checkedData(inputOf(draft.data));
    const now = new Date();
    await tx.nativeUpdate(RateBookVersion, { company: editor.companyId, status: 'published' }, { status: 'retired', retiredAt: now });
    await tx.nativeUpdate(
      RateBookVersion,
      { id: draft.id },
      { status: 'published', publishedAt: now, publishedBy: editor.userId, ...(input.note ? { note: input.note } : {}) },
    );
    return draft.id;
  });
  // This process prices with the new version at once; others within PUBLISHED_RATES_CACHE_MS.
  await em.clearCache(publishedRatesCacheKey(editor.companyId));
  const version = await em.findOneOrFail(RateBookVersion, { id: published }, { populate, refresh: true });
  return summaryOf(version);
}

/** A version's numbers as the estimate and the triage score use them, every default filled in. */
function asPriced(data: Envelope<RateBookInput>) {
  const rates = storedRateBook.read(data);
  return { ...rates, triage: rates.triage ?? DEFAULT_TRIAGE_WEIGHTS };
}

/** Two versions of the firm, field by field, as they price. */
export async function compareVersions(em: EntityManager, companyId: string, beforeId: string, afterId: string) {
  const [before, after] = await Promise.all([
    em.findOne(RateBookVersion, { id: beforeId, company: companyId }),
    em.findOne(RateBookVersion, { id: afterId, company: companyId }),
  ]);
  if (!before || !after) throw new NotFound('No such version.');
  return {
    before: summaryOf(before),
    after: summaryOf(after),
    // As the estimate reads them, defaults filled in: a field left out of one version and set to
    // its default in the other prices the same, so it is no change.
    changes: jsonChanges(asPriced(before.data), asPriced(after.data)),
  };
}
