import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { readJson } from '~/lib/server/http';
import { canEditRates } from '~/lib/server/rates/policy';
import { discardDraft, openDraft, saveDraft } from '~/lib/server/rates/rate-book-drafts';
import { discardDraftSchema, openDraftSchema, saveDraftSchema } from '~/lib/shared/rate-book-schemas';

const guard = { may: canEditRates, hidden: true };

/** Opens the firm's draft: the existing one (200), or a copy of the published version (201). */
export const POST = staffEndpoint(guard, async ({ staff, locals, request }) => {
  const input = await readJson(request, openDraftSchema);
  const { draft, created } = await openDraft(locals.em, staff, input.fromVersionId);
  return Response.json(draft, { status: created ? 201 : 200 });
});

/** Saves the draft's numbers when `revision` is the stored one; 409 with what differs when not. */
export const PUT = staffEndpoint(guard, async ({ staff, locals, request }) => {
  const input = await readJson(request, saveDraftSchema);
  return Response.json(await saveDraft(locals.em, staff, input));
});

/** Throws the draft away. */
export const DELETE = staffEndpoint(guard, async ({ staff, locals, request }) => {
  await discardDraft(locals.em, staff, await readJson(request, discardDraftSchema));
  return new Response(null, { status: 204 });
});
