import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { readJson } from '~/lib/server/http';
import { canUseSetup } from '~/lib/server/companies/policy';
import { canSeeLeads } from '~/lib/server/leads/policy';
import { createTemplate, presentTemplate, templatesOfFirm } from '~/lib/server/leads/mail-templates';
import { mailTemplateSchema } from '~/lib/shared/inquiry-work-schemas';

/** The firm's e-mail templates. Owner and sales (sales send from them). */
export const GET = staffEndpoint({ may: canSeeLeads }, async ({ staff, locals }) =>
  Response.json({ templates: (await templatesOfFirm(locals.em, staff.companyId)).map(presentTemplate) }),
);

/** Adds a template. Owner only. */
export const POST = staffEndpoint({ may: canUseSetup, hidden: true }, async ({ staff, locals, request }) => {
  const input = await readJson(request, mailTemplateSchema);
  return Response.json(presentTemplate(await createTemplate(locals.em, staff.companyId, input)), { status: 201 });
});
