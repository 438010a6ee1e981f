import { expect, request, type APIRequestContext } from '@playwright/test';

export const BASE_URL = process.env.PUBLIC_ORIGIN ?? 'http://127.0.0.1:4321';
/** Demo data only (see README). */
export const DEMO_PASSWORD = 'lapwing-demo-2026';

/**
 * A signed-in HTTP client for one demo person. It sends our own Origin, as a browser on our pages
 * would; the CSRF tests send other origins on purpose.
 */
export async function signedInAs(email: string): Promise<APIRequestContext> {
  const context = await request.newContext({ baseURL: BASE_URL, extraHTTPHeaders: { Origin: BASE_URL } });
  const response = await context.post('/login', { form: { email, password: DEMO_PASSWORD }, maxRedirects: 0 });
  expect(response.status(), `sign-in of ${email}`).toBe(303);
  return context;
}

export async function signedOut(): Promise<APIRequestContext> {
  return request.newContext({ baseURL: BASE_URL, extraHTTPHeaders: { Origin: BASE_URL } });
}
