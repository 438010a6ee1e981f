import { randomUUID } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import { FunnelEvent, type FunnelStep } from './funnel-event.entity';

/** Counts a step once per widget draft; repeats are ignored by the unique key. */
export async function recordFunnelStep(em: EntityManager, companyId: string, draftId: string, step: FunnelStep): Promise<void> {
  await em
    .createQueryBuilder(FunnelEvent)
    .insert({ id: randomUUID(), company: companyId, draftId, step })
    .onConflict(['company', 'draftId', 'step'])
    .ignore()
    .execute();
}
