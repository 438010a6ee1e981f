import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { readJson } from '~/lib/server/http';
import { listColumnsOf, saveListColumns } from '~/lib/server/leads/list-columns';
import { canSeeLeads } from '~/lib/server/leads/policy';
import { listColumnsSchema } from '~/lib/shared/inquiry-list';

/** The Inquiries list's columns this person keeps (in the active firm). */
export const GET = staffEndpoint({ may: canSeeLeads }, async ({ staff, locals }) => Response.json({ columns: await listColumnsOf(locals.em, staff) }));

export const PUT = staffEndpoint({ may: canSeeLeads }, async ({ staff, locals, request }) => {
  const { columns } = await readJson(request, listColumnsSchema);
  return Response.json({ columns: await saveListColumns(locals.em, staff, columns) });
});
