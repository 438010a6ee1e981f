import { randomUUID } from 'node:crypto';
import { query } from '../../helpers/app-database';

/**
 * A firm of its own for a story that changes firm-wide state (publishing a Rate book): a copy of a
 * demo firm's row, its owner's account (same demo password) and its published Rate book, under a
 * new slug, so specs running beside it keep meeting the demo firms as seeded.
 */
export type StoryFirm = { companyId: string; slug: string; ownerEmail: string };

async function columnsOf(table: string): Promise<string[]> {
  const rows = await query<{ column_name: string }>(
    `select column_name from information_schema.columns where table_schema = current_schema() and table_name = $1 and is_generated = 'NEVER' order by ordinal_position`,
    [table],
  );
  return rows.map((r) => r.column_name);
}

/** Inserts a copy of the one row `where` finds, with `changes` in place of its columns; returns the new id. */
async function copyRow(table: string, where: string, whereParams: unknown[], changes: Record<string, unknown>): Promise<string> {
  const columns = await columnsOf(table);
  const params = [...whereParams];
  const picks = columns.map((column) => {
    if (!(column in changes)) return `"${column}"`;
    params.push(changes[column]);
    return `$${params.length}`;
  });
  const [row] = await query<{ id: string }>(
    `insert into "${table}" (${columns.map((c) => `"${c}"`).join(', ')}) select ${picks.join(', ')} from "${table}" where ${where} returning "id"`,
    params,
  );
  if (!row) throw new Error(`No ${table} row to copy where ${where}`);
  return row.id;
}

export async function storyFirm(from: { slug: string; ownerEmail: string }, name: string): Promise<StoryFirm> {
  const tag = randomUUID().slice(0, 8);
  const slug = `story-${tag}`;
  const ownerEmail = `owner-${tag}@story-firm.test`;
  const [source] = await query<{ id: string }>(`select id from company where slug = $1`, [from.slug]);
  const companyId = await copyRow('company', 'slug = $1', [from.slug], { id: randomUUID(), slug, name: `${name} ${tag}` });
  const userId = await copyRow('app_user', 'email = $1', [from.ownerEmail], { id: randomUUID(), email: ownerEmail, name: `Owner ${tag}` });
  await copyRow('membership', 'company_id = $1 and user_id = (select id from app_user where email = $2)', [source!.id, from.ownerEmail], {
    id: randomUUID(),
    company_id: companyId,
    user_id: userId,
    role: 'owner',
  });
  await copyRow('rate_book_version', `company_id = $1 and status = 'published'`, [source!.id], {
    id: randomUUID(),
    company_id: companyId,
    number: 1,
    note: 'Starting rates',
  });
  return { companyId, slug, ownerEmail };
}
