/**
 * An inquiry taken on the phone: staff type the homeowner's rooms into the same form as the price
 * widget, it is priced the same way (`estimateForFirm`, the firm's published Rate book), and
 * `createLead` stores it as "Entered by staff" with the staff member as the one who received it.
 * No photos come with it; consent is the staff member's confirmation that the homeowner agreed.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import type { z } from 'zod';
import type { staffLeadRequestSchema } from '~/lib/shared/intake-schemas';
import { Company } from '../companies/company.entity';
import { estimateForFirm } from '../estimates/estimate.service';
import { createLead, leadForIdempotencyKey, requestDigestOf, type CreatedLead } from '../leads/lead.service';

export type StaffLeadRequestParsed = z.output<typeof staffLeadRequestSchema>;

export async function createStaffLead(
  em: EntityManager,
  companyId: string,
  request: StaffLeadRequestParsed,
  enteredByUserId: string,
  now = new Date(),
): Promise<CreatedLead & { repeated: boolean }> {
  const company = await em.findOneOrFail(Company, { id: companyId });
  const project = { ...request.project, photoCount: 0 };
  // The digest covers what createLead stores, so a retried save finds the first one.
  const repeated = await leadForIdempotencyKey(em, company, request.idempotencyKey, requestDigestOf({ project, contact: request.contact }));
  if (repeated) return { ...repeated, repeated: true };
  const estimate = await estimateForFirm(em, company, project);
  const created = await createLead(em, company, {
    contact: request.contact,
    project,
    estimate,
    source: 'staff',
    consentAt: now,
    idempotencyKey: request.idempotencyKey,
    enteredByUserId,
  });
  return { ...created, repeated: false };
}
