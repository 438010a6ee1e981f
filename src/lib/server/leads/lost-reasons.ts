import { randomUUID } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import { DEFAULT_LOST_REASONS } from '~/lib/shared/lead-flow-schemas';
import { LostReasonList } from './lost-reason-list.entity';

/** The firm's reasons an inquiry is not going ahead: its own list, or the defaults until it saves one. */
export async function lostReasonsOf(em: EntityManager, companyId: string): Promise<string[]> {
  const list = await em.findOne(LostReasonList, { company: companyId });
  return list ? [...list.reasons] : [...DEFAULT_LOST_REASONS];
}

/** Replaces the firm's list (already checked by `lostReasonsSchema`). */
export async function saveLostReasons(em: EntityManager, companyId: string, reasons: string[]): Promise<string[]> {
  // One statement, so two owners saving at once cannot both try to create the firm's row.
  await em.getConnection().execute(
    `insert into "lost_reason_list" ("id", "company_id", "reasons") values (?, ?, ?::jsonb)
     on conflict ("company_id") do update set "reasons" = excluded."reasons", "updated_at" = now()`,
    [randomUUID(), companyId, JSON.stringify(reasons)],
  );
  return reasons;
}
