// DELETE /api/embed/SLUG/photos/ID — {formToken} → 204; the homeowner removes a photo before sending.
import type { APIRoute } from 'astro';
import { errorResponse, NotFound } from '../../../../../../lib/server/errors';
import { readJson } from '../../../../../../lib/server/http';
import { removePhoto } from '../../../../../../lib/server/photos/lead-photo.service';
import { limitPhotoCalls } from '../../../../../../lib/server/photos/photo-rate-limit';
import { openWidgetDraft } from '../../../../../../lib/server/photos/widget-draft';
import { photoFormTokenSchema, photoIdSchema } from '../../../../../../lib/shared/photo-schemas';

export const DELETE: APIRoute = async ({ params, request, locals, clientAddress }) => {
  try {
    await limitPhotoCalls(clientAddress);
    const photoId = photoIdSchema.safeParse(params.id);
    if (!photoId.success) throw new NotFound('This photo is not part of this form.');
    const body = await readJson(request, photoFormTokenSchema);
    const { company, draftId } = await openWidgetDraft(locals.em, params.slug ?? '', body.formToken);
    await removePhoto(locals.em, { companyId: company.id, draftId, photoId: photoId.data });
    return new Response(null, { status: 204 });
  } catch (error) {
    return errorResponse(error);
  }
};
