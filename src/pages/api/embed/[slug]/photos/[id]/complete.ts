// POST /api/embed/SLUG/photos/ID/complete — {formToken} → 200 {photo: {id, width, height, thumbnailUrl}}
// or 400 {error, fields: {photo}} when the file is refused.
import type { APIRoute } from 'astro';
import { errorResponse } from '../../../../../../lib/server/errors';
import { completeUpload } from '../../../../../../lib/server/photos/lead-photo.service';
import { limitPhotoCalls } from '../../../../../../lib/server/photos/photo-rate-limit';
import { presentWidgetPhoto } from '../../../../../../lib/server/photos/present-photo';
import { openDraftPhoto } from '../../../../../../lib/server/photos/widget-draft';

export const POST: APIRoute = async ({ params, request, locals, clientAddress }) => {
  try {
    await limitPhotoCalls(clientAddress);
    const { company, draftId, photoId } = await openDraftPhoto(locals.em, params.slug ?? '', params.id, request);
    const photo = await completeUpload(locals.em, { companyId: company.id, draftId, photoId });
    return Response.json({ photo: await presentWidgetPhoto(photo) });
  } catch (error) {
    return errorResponse(error);
  }
};
