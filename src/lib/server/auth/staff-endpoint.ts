import type { APIContext, APIRoute } from 'astro';
import { errorResponse } from '../errors';
import { requireStaff, type GuardOptions, type Staff } from './guard';

/**
 * Wraps a staff API route: runs the guard (with an optional policy), then the handler, and maps
 * every error to the JSON shape `{"error", "fields"}` with its status.
 *
 *   export const GET = staffEndpoint({ may: canManageTeam }, ({ staff, locals }) => ...);
 */
export function staffEndpoint(options: GuardOptions, handler: (context: APIContext & { staff: Staff }) => Promise<Response> | Response): APIRoute {
  return async (context) => {
    try {
      const staff = requireStaff(context.locals, options);
      return await handler(Object.assign(context, { staff }));
    } catch (error) {
      return errorResponse(error);
    }
  };
}
