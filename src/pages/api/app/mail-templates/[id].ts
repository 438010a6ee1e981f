import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { readJson } from '~/lib/server/http';
import { canUseSetup } from '~/lib/server/companies/policy';
import { deleteTemplate, presentTemplate, updateTemplate } from '~/lib/server/leads/mail-templates';
import { mailTemplateSchema } from '~/lib/shared/inquiry-work-schemas';

/** Changes a template's name, subject and message. Owner only. */
export const PATCH = staffEndpoint({ may: canUseSetup, hidden: true }, async ({ staff, locals, params, request }) => {
  const input = await readJson(request, mailTemplateSchema);
  return Response.json(presentTemplate(await updateTemplate(locals.em, staff.companyId, params.id ?? '', input)));
});

/** Removes a template (e-mails already sent from it keep their copy on the timeline). Owner only. */
export const DELETE = staffEndpoint({ may: canUseSetup, hidden: true }, async ({ staff, locals, params }) => {
  await deleteTemplate(locals.em, staff.companyId, params.id ?? '');
  return new Response(null, { status: 204 });
});
