import type { EntityManager } from '@mikro-orm/postgresql';
import type { Company } from '../companies/company.entity';
import { companyBySlug } from '../companies/company.repository';
import { verifyFormToken } from '../embed/form-token';
import { NotFound } from '../errors';
import { readJson } from '../http';
import { photoFormTokenSchema, photoIdSchema } from '../../shared/photo-schemas';

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

/**
 * The draft photo a widget call names: the id from the URL (a malformed one is simply not found)
 * and the draft from the form token in the JSON body.
 */
export async function openDraftPhoto(em: EntityManager, slug: string, idParam: string | undefined, request: Request): Promise<WidgetDraft & { photoId: string }> {
  const photoId = photoIdSchema.safeParse(idParam);
  if (!photoId.success) throw new NotFound('This photo is not part of this form.');
  const body = await readJson(request, photoFormTokenSchema);
  return { ...(await openWidgetDraft(em, slug, body.formToken)), photoId: photoId.data };
}
