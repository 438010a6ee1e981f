// POST /api/embed/SLUG/photos — {formToken, name, size, type} → 201 {photo: {id}, upload: {url, fields}}
import type { APIRoute } from 'astro';
import { readJson } from '~/lib/server/http';
import { PHOTO_CALL_LIMITS } from '~/lib/server/embed/photo-limits';
import { preflight, publicEndpoint } from '~/lib/server/embed/public-api';
import { openWidgetDraft } from '~/lib/server/embed/widget-estimate';
import { requestUpload } from '~/lib/server/photos/lead-photo.service';
import { photoUploadRequestSchema } from '~/lib/shared/photo-schemas';

export const POST: APIRoute = publicEndpoint('widget-photos', PHOTO_CALL_LIMITS, async ({ em, company, request }) => {
  const body = await readJson(request, photoUploadRequestSchema);
  const { draftId } = openWidgetDraft(company, body.formToken);
  const { photo, upload } = await requestUpload(em, { companyId: company.id, draftId, name: body.name, size: body.size, type: body.type });
  return { status: 201, body: { photo: { id: photo.id }, upload } };
});

export const OPTIONS: APIRoute = preflight();
