import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { authorize } from '~/lib/server/auth/guard';
import { canSeeLead, canSeeLeads } from '~/lib/server/leads/policy';
import { leadOfCompany } from '~/lib/server/leads/lead.repository';
import { galleryPhotos } from '~/lib/server/photos/gallery';

/** The inquiry's photos with freshly signed links (they last minutes; the gallery asks again before then). Owner and sales. */
export const GET = staffEndpoint({ may: canSeeLeads }, async ({ staff, locals, params }) => {
  const lead = await leadOfCompany(locals.em, staff.companyId, params.id ?? '');
  authorize(staff, canSeeLead, lead);
  return Response.json(await galleryPhotos(locals.em, { companyId: staff.companyId, leadId: lead.id }));
});
