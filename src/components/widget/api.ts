import type { ProjectInput } from '~/lib/estimate/index.ts';
import type { HomeownerEstimate } from '~/lib/shared/homeowner-estimate';
import type { ContactInput } from '~/lib/shared/lead-schemas';

export class ApiError extends Error {
  constructor(
    message: string,
    readonly status: number,
    readonly fields: Record<string, string> = {},
  ) {
    super(message);
  }
}

async function postJson<T>(url: string, body: unknown): Promise<T> {
  let response: Response;
  try {
    response = await fetch(url, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify(body) });
  } catch {
    throw new ApiError('We could not reach the server. Check your connection and try again.', 0);
  }
  const data = await response.json().catch(() => ({}));
  if (!response.ok) throw new ApiError(data.error ?? 'Something went wrong. Please try again.', response.status, data.fields ?? {});
  return data as T;
}

export function fetchEstimate(slug: string, formToken: string, project: ProjectInput): Promise<HomeownerEstimate> {
  return postJson<{ estimate: HomeownerEstimate }>(`/api/embed/${slug}/estimate`, { formToken, project }).then((d) => d.estimate);
}

export type SentLead = { lead: { reference: string; viewUrl: string | null }; estimate: HomeownerEstimate | null };

export function sendLead(
  slug: string,
  body: { formToken: string; idempotencyKey: string; project: ProjectInput; contact: ContactInput; website?: string },
): Promise<SentLead> {
  return postJson<SentLead>(`/api/embed/${slug}/leads`, body);
}
