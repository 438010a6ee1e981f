import type { APIRoute } from 'astro';

/** Liveness and database reachability, for load balancers and the test harness. */
export const GET: APIRoute = async ({ locals }) => {
  await locals.em.getConnection().execute('select 1');
  return Response.json({ ok: true });
};
