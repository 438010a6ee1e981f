import type { APIRoute } from 'astro';
import { requireStaff } from '~/lib/server/auth/guard';
import { setSessionFirm } from '~/lib/server/auth/sessions';
import { errorResponse, NotFound } from '~/lib/server/errors';
import { parseInput, readForm } from '~/lib/server/http';
import { switchFirmSchema } from '~/lib/shared/auth-schemas';

/** Switches the firm this session works in, to another firm the same person belongs to. */
export const POST: APIRoute = async ({ locals, request, redirect }) => {
  try {
    const staff = requireStaff(locals);
    const { companyId } = parseInput(switchFirmSchema, await readForm(request));
    if (!locals.memberships.some((m) => m.companyId === companyId)) throw new NotFound();
    await setSessionFirm(locals.em, staff.sessionToken, companyId);
    return redirect('/app', 303);
  } catch (error) {
    return errorResponse(error);
  }
};
