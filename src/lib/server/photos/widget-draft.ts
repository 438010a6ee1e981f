import type { EntityManager } from '@mikro-orm/postgresql';
import type { Company } from '../companies/company.entity';
import { companyBySlug } from '../companies/company.repository';
import { verifyFormToken } from '../embed/form-token';

export type WidgetDraft = { company: Company; draftId: string };

/**
 * The firm behind a widget URL and the homeowner's draft, proven by the form token. The widget has
 * no cookies, so the token is the only authority: it names the firm and the draft photos belong to.
 * Unknown slug: NotFound. A token for another firm or past its age: InvalidInput on `formToken`.
 */
export async function openWidgetDraft(em: EntityManager, slug: string, formToken: string): Promise<WidgetDraft> {
  const company = await companyBySlug(em, slug);
  const { draftId } = verifyFormToken(formToken, company.id);
  return { company, draftId };
}
