// POST /api/embed/SLUG/photos/ID/complete — {formToken} → 200 {photo: {id, width, height, thumbnailUrl}}
// or 400 {error, fields: {photo}} when the file is refused.
import type { APIRoute } from 'astro';
import { errorResponse, NotFound } from '../../../../../../lib/server/errors';
import { readJson } from '../../../../../../lib/server/http';
import { completeUpload } from '../../../../../../lib/server/photos/lead-photo.service';
import { limitPhotoCalls } from '../../../../../../lib/server/photos/photo-rate-limit';
import { presentWidgetPhoto } from '../../../../../../lib/server/photos/present-photo';
import { openWidgetDraft } from '../../../../../../lib/server/photos/widget-draft';
import { photoFormTokenSchema, photoIdSchema } from '../../../../../../lib/shared/photo-schemas';

export const POST: APIRoute = async ({ params, request, locals, clientAddress }) => {
  try {
    await limitPhotoCalls(clientAddress);
    const photoId = photoIdSchema.safeParse(params.id);
    if (!photoId.success) throw new NotFound('This photo is not part of this form.');
    const body = await readJson(request, photoFormTokenSchema);
    const { company, draftId } = await openWidgetDraft(locals.em, params.slug ?? '', body.formToken);
    const photo = await completeUpload(locals.em, { companyId: company.id, draftId, photoId: photoId.data });
    return Response.json({ photo: await presentWidgetPhoto(photo) });
  } catch (error) {
    return errorResponse(error);
  }
};
