// POST /api/embed/SLUG/photos/ID/complete — {formToken} → 200 {photo: {id, width, height, thumbnailUrl}}
// or 400 {error, fields: {photo}} when the file is refused.
import type { APIRoute } from 'astro';
import { readJson } from '~/lib/server/http';
import { PHOTO_CALL_LIMITS, photoIdOf } from '~/lib/server/embed/photo-limits';
import { preflight, publicEndpoint } from '~/lib/server/embed/public-api';
import { openWidgetDraft } from '~/lib/server/embed/widget-estimate';
import { completeUpload } from '~/lib/server/photos/lead-photo.service';
import { presentWidgetPhoto } from '~/lib/server/photos/present-photo';
import { photoFormTokenSchema } from '~/lib/shared/photo-schemas';

export const POST: APIRoute = publicEndpoint('widget-photos', PHOTO_CALL_LIMITS, async ({ em, company, request, params }) => {
  const photoId = photoIdOf(params.id);
  const { draftId } = openWidgetDraft(company, (await readJson(request, photoFormTokenSchema)).formToken);
  const photo = await completeUpload(em, { companyId: company.id, draftId, photoId });
  return { status: 200, body: { photo: await presentWidgetPhoto(photo) } };
});

export const OPTIONS: APIRoute = preflight();
