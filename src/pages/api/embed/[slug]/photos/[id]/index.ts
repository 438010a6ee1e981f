// DELETE /api/embed/SLUG/photos/ID — {formToken} → 204; the homeowner removes a photo before sending.
import type { APIRoute } from 'astro';
import { errorResponse } from '../../../../../../lib/server/errors';
import { removePhoto } from '../../../../../../lib/server/photos/lead-photo.service';
import { limitPhotoCalls } from '../../../../../../lib/server/photos/photo-rate-limit';
import { openDraftPhoto } from '../../../../../../lib/server/photos/widget-draft';

export const DELETE: APIRoute = async ({ params, request, locals, clientAddress }) => {
  try {
    await limitPhotoCalls(clientAddress);
    const { company, draftId, photoId } = await openDraftPhoto(locals.em, params.slug ?? '', params.id, request);
    await removePhoto(locals.em, { companyId: company.id, draftId, photoId });
    return new Response(null, { status: 204 });
  } catch (error) {
    return errorResponse(error);
  }
};
