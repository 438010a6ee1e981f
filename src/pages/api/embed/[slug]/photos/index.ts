// POST /api/embed/SLUG/photos — {formToken, name, size, type} → 201 {photo: {id}, upload: {url, fields}}
import type { APIRoute } from 'astro';
import { errorResponse } from '../../../../../lib/server/errors';
import { readJson } from '../../../../../lib/server/http';
import { requestUpload } from '../../../../../lib/server/photos/lead-photo.service';
import { limitPhotoCalls } from '../../../../../lib/server/photos/photo-rate-limit';
import { openWidgetDraft } from '../../../../../lib/server/photos/widget-draft';
import { photoUploadRequestSchema } from '../../../../../lib/shared/photo-schemas';

export const POST: APIRoute = async ({ params, request, locals, clientAddress }) => {
  try {
    await limitPhotoCalls(clientAddress);
    const body = await readJson(request, photoUploadRequestSchema);
    const { company, draftId } = await openWidgetDraft(locals.em, params.slug ?? '', body.formToken);
    const { photo, upload } = await requestUpload(locals.em, { companyId: company.id, draftId, name: body.name, size: body.size, type: body.type });
    return Response.json({ photo: { id: photo.id }, upload }, { status: 201 });
  } catch (error) {
    return errorResponse(error);
  }
};
