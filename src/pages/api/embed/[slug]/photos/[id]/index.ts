// DELETE /api/embed/SLUG/photos/ID — {formToken} → 204; the homeowner removes a photo before sending.
import type { APIRoute } from 'astro';
import { readJson } from '~/lib/server/http';
import { PHOTO_CALL_LIMITS, photoIdOf } from '~/lib/server/embed/photo-limits';
import { preflight, publicEndpoint } from '~/lib/server/embed/public-api';
import { openWidgetDraft } from '~/lib/server/embed/widget-estimate';
import { removePhoto } from '~/lib/server/photos/lead-photo.service';
import { photoFormTokenSchema } from '~/lib/shared/photo-schemas';

export const DELETE: APIRoute = publicEndpoint('widget-photos', PHOTO_CALL_LIMITS, async ({ em, company, request, params }) => {
  const photoId = photoIdOf(params.id);
  const { draftId } = openWidgetDraft(company, (await readJson(request, photoFormTokenSchema)).formToken);
  await removePhoto(em, { companyId: company.id, draftId, photoId });
  return { status: 204 };
});

export const OPTIONS: APIRoute = preflight();
