/**
 * The widget's estimate: verify the form token, count the photos that actually arrived under its
 * draft, price the project with the firm's published rates, present it. Used by the live range and
 * by a sent inquiry, so both give the same numbers for the same answers.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import type { Project } from '~/lib/estimate';
import type { Company } from '../companies/company.entity';
import { estimateForFirm, type FirmEstimate } from '../estimates/estimate.service';
import { readyPhotoCount } from '../photos/lead-photo.service';
import { verifyFormToken, type FormToken } from './form-token';

export type WidgetEstimate = FirmEstimate & { token: FormToken; project: Project; photoCount: number };

/** Checks the form token (InvalidInput on `formToken` when it is not this firm's or too old). */
export function openWidgetDraft(company: Company, formToken: string, now = Date.now()): FormToken {
  return verifyFormToken(formToken, company.id, now);
}

/** Prices the draft's project; the photo count that widens or narrows the range is the server's own. */
export async function estimateForDraft(em: EntityManager, company: Company, token: FormToken, project: Project): Promise<WidgetEstimate> {
  const photoCount = await readyPhotoCount(em, { companyId: company.id, draftId: token.draftId });
  const counted = { ...project, photoCount };
  return { ...(await estimateForFirm(em, company, counted)), token, project: counted, photoCount };
}
