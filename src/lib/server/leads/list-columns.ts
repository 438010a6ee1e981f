import { randomUUID } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import { INQUIRY_COLUMN_IDS, type InquiryColumn } from '~/lib/shared/inquiry-list';
import { ListColumnChoice } from './list-column-choice.entity';

/** The columns this person keeps on the Inquiries list in this firm; all of them until they choose. */
export async function listColumnsOf(em: EntityManager, who: { companyId: string; userId: string }): Promise<InquiryColumn[]> {
  const choice = await em.findOne(ListColumnChoice, { company: who.companyId, user: who.userId });
  // A column id a later version dropped is left out; the choice stays usable.
  const kept = choice?.columns.filter((c) => INQUIRY_COLUMN_IDS.includes(c)) ?? [];
  return kept.length ? kept : [...INQUIRY_COLUMN_IDS];
}

/** Keeps a person's column choice (one row per person and firm; the last choice wins). */
export async function saveListColumns(em: EntityManager, who: { companyId: string; userId: string }, columns: InquiryColumn[]): Promise<InquiryColumn[]> {
  const ordered = INQUIRY_COLUMN_IDS.filter((c) => columns.includes(c));
  await em.upsert(
    ListColumnChoice,
    { id: randomUUID(), company: who.companyId, user: who.userId, columns: ordered },
    { onConflictFields: ['company', 'user'], onConflictMergeFields: ['columns', 'updatedAt'] },
  );
  return ordered;
}
