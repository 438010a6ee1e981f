import { randomUUID } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import { FunnelEvent, type FunnelStep } from './funnel-event.entity';

// Steps this process has already written: the live range asks for an estimate many times per visit,
// and only the first counts. A miss here costs one ignored insert, so the set may be small and lossy.
const recorded = new Set<string>();
const RECORDED_LIMIT = 10_000;

/** Counts a step once per widget draft; repeats are ignored by the unique key. */
export async function recordFunnelStep(em: EntityManager, companyId: string, draftId: string, step: FunnelStep): Promise<void> {
  const key = `${draftId}:${step}`;
  if (recorded.has(key)) return;
  await em
    .createQueryBuilder(FunnelEvent)
    .insert({ id: randomUUID(), company: companyId, draftId, step })
    .onConflict(['company', 'draftId', 'step'])
    .ignore()
    .execute();
  if (recorded.size >= RECORDED_LIMIT) recorded.clear();
  recorded.add(key);
}
