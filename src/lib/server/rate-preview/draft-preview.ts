/**
 * What publishing the draft would do, before the owner publishes it: sample rooms priced with the
 * draft beside the published version, and a replay of the last 90 days of inquiries under both. A
 * small replay runs in the request; a large one runs as a job that reports its progress.
 */
import type { EntityManager, FilterQuery } from '@mikro-orm/postgresql';
import type { RateBook } from '~/lib/estimate';
import { now } from '../clock';
import { NotFound } from '../errors';
import { defineJob, sendJobIfRunning } from '../jobs/runner';
import { Lead } from '../leads/lead.entity';
import { leadInputs } from '../leads/lead-inputs';
import { publishedRatesIfAny } from '../rates/rate-book.service';
import { NoDraft } from '../rates/rate-book-drafts';
import { RateBookVersion } from '../rates/rate-book-version.entity';
import { storedRateBook } from '../rates/stored-rate-book';
import { priceWith, type PricedSide } from './priced-pair';
import { RateBookReplay } from './rate-book-replay.entity';
import { summariseReplay, type ReplayedInquiry } from './replay-summary';
import { sampleRooms } from './sample-rooms';

export const REPLAY_DAYS = 90;
/** Up to this many inquiries are replayed in the request; more go to the job. */
export const INLINE_REPLAY_LIMIT = 60;
const BATCH = 25;

async function currentDraft(em: EntityManager, companyId: string): Promise<{ draft: RateBookVersion; rates: RateBook }> {
  const draft = await em.findOne(RateBookVersion, { company: companyId, status: 'draft' }, { refresh: true });
  if (!draft) throw new NoDraft('There is no draft to preview. Open a draft first.');
  return { draft, rates: storedRateBook.read(draft.data) };
}

export type SampleComparison = {
  treatmentId: string;
  treatmentName: string;
  description: string;
  published: PricedSide | null;
  draft: PricedSide;
};

/** Each finish's sample room, priced by the published version (if any) and by the draft. */
export async function previewSamples(em: EntityManager, companyId: string) {
  const { draft, rates } = await currentDraft(em, companyId);
  const published = await publishedRatesIfAny(em, companyId);
  const rooms: SampleComparison[] = [];
  for (const room of sampleRooms(published?.rateBook ?? null, rates)) {
    rooms.push({
      treatmentId: room.treatmentId,
      treatmentName: room.treatmentName,
      description: room.description,
      published: published ? await priceWith({ projectInput: room.project }, published.rateBook) : null,
      draft: await priceWith({ projectInput: room.project }, rates),
    });
  }
  return { draft: { number: draft.number, revision: draft.revision }, published: published ? { number: published.version.number } : null, rooms };
}

const recentLeads = (companyId: string) => ({
  company: companyId,
  deletedAt: null,
  createdAt: { $gte: new Date(now().getTime() - REPLAY_DAYS * 86_400_000) },
});

export type ReplayView = {
  id: string;
  status: RateBookReplay['status'];
  done: number;
  total: number;
  draftRevision: number;
  summary: RateBookReplay['summary'];
  failure: string | null;
};

const viewOf = (r: RateBookReplay): ReplayView => ({
  id: r.id,
  status: r.status,
  done: r.done,
  total: r.total,
  draftRevision: r.draftRevision,
  summary: r.summary,
  failure: r.failure,
});

/** Starts a replay of the draft's current revision: finished at once when small, queued when large. */
export async function startReplay(em: EntityManager, companyId: string): Promise<ReplayView> {
  const { draft } = await currentDraft(em, companyId);
  const total = await em.count(Lead, recentLeads(companyId));
  const replay = em.create(RateBookReplay, { company: companyId, draft, draftRevision: draft.revision, total });
  await em.flush();
  const queued = total > INLINE_REPLAY_LIMIT ? await sendJobIfRunning(rateBookReplayJob.name, { replayId: replay.id }) : null;
  // Small, or no job runner in this process: the request does the work.
  if (!queued) await runReplay(em, replay.id);
  return viewOf(await em.findOneOrFail(RateBookReplay, { id: replay.id }, { refresh: true }));
}

export async function replayOf(em: EntityManager, companyId: string, id: string): Promise<ReplayView> {
  const replay = await em.findOne(RateBookReplay, { id, company: companyId });
  if (!replay) throw new NotFound('No such replay.');
  return viewOf(replay);
}

/** Prices each recent inquiry with both versions, batch by batch, recording progress as it goes. */
export async function runReplay(em: EntityManager, replayId: string): Promise<void> {
  const replay = await em.findOne(RateBookReplay, { id: replayId }, { populate: ['draft'] });
  if (!replay || replay.status === 'done') return;
  const companyId = replay.company.id;
  try {
    replay.status = 'running';
    await em.flush();
    // The draft's numbers as they were at that revision are what it holds now, or a newer revision:
    // a replay of an older revision is finished with the draft as it stands and says which revision.
    const draftRates = storedRateBook.read(replay.draft.data);
    const published = await publishedRatesIfAny(em, companyId);
    const rows: ReplayedInquiry[] = [];
    let after: { createdAt: Date; id: string } | null = null;
    for (;;) {
      const where: FilterQuery<Lead> = after
        ? { ...recentLeads(companyId), $or: [{ createdAt: { $gt: after.createdAt } }, { createdAt: after.createdAt, id: { $gt: after.id } }] }
        : recentLeads(companyId);
      const batch: Pick<Lead, 'id' | 'reference' | 'inputs' | 'createdAt'>[] = await em.find(Lead, where, {
        orderBy: { createdAt: 'asc', id: 'asc' },
        limit: BATCH,
        fields: ['id', 'reference', 'inputs', 'createdAt'],
      });
      for (const lead of batch) {
        const project = leadInputs.read(lead.inputs);
        rows.push({
          leadId: lead.id,
          reference: lead.reference,
          published: published ? await priceWith({ project }, published.rateBook) : { ok: false, reason: 'No published version yet.' },
          draft: await priceWith({ project }, draftRates),
        });
      }
      if (batch.length > 0) {
        after = { createdAt: batch[batch.length - 1].createdAt, id: batch[batch.length - 1].id };
        await em.nativeUpdate(RateBookReplay, { id: replayId }, { done: rows.length, total: Math.max(replay.total, rows.length) });
      }
      if (batch.length < BATCH) break;
    }
    await em.nativeUpdate(RateBookReplay, { id: replayId }, { status: 'done', done: rows.length, total: rows.length, summary: summariseReplay(rows) });
  } catch (error) {
    await em.nativeUpdate(RateBookReplay, { id: replayId }, { status: 'failed', failure: String((error as Error)?.message ?? error).slice(0, 300) });
    throw error;
  }
}

export const rateBookReplayJob = defineJob<{ replayId: string }>({
  name: 'rate-book-replay',
  queue: { retryLimit: 0, expireInSeconds: 15 * 60 },
  pollingIntervalSeconds: 1,
  async run({ replayId }, { em }) {
    await runReplay(em, replayId);
  },
});
