import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { Company } from '~/lib/server/companies/company.entity';
import { estimateForFirm } from '~/lib/server/estimates/estimate.service';
import { readJson } from '~/lib/server/http';
import { canEnterLead } from '~/lib/server/leads/policy';
import { staffEstimateRequestSchema } from '~/lib/shared/intake-schemas';

/** The live range of a phone inquiry being typed in: the widget's estimate of the same rooms (no photos). */
export const POST = staffEndpoint({ may: canEnterLead }, async ({ staff, locals, request }) => {
  const { project } = await readJson(request, staffEstimateRequestSchema);
  const company = await locals.em.findOneOrFail(Company, { id: staff.companyId });
  const { view } = await estimateForFirm(locals.em, company, { ...project, photoCount: 0 });
  return Response.json({ estimate: view });
});
