import { expect, test } from '@playwright/test';
import { signedInAs, signedOut } from './helpers/staff';

// Ids that are not UUIDs must never reach a uuid column: PostgreSQL refuses them with an error,
// which used to surface as a 500. Every lookup checks the shape first and answers "not found".
const MALFORMED = ['-'.repeat(36), '0'.repeat(36), 'not-a-uuid', `${'a'.repeat(8)}-zzzz-zzzz-zzzz-${'a'.repeat(12)}`];

test('the homeowner’s page answers 404 for a malformed estimate id, never 500', async () => {
  const visitor = await signedOut();
  for (const id of MALFORMED) {
    const response = await visitor.get(`/estimate/${id}?key=${'k'.repeat(32)}`);
    expect(response.status(), id).toBe(404);
  }
  await visitor.dispose();
});

test('staff forms and routes answer 404 for malformed ids, never 500', async () => {
  const owner = await signedInAs('olive@cedar-hollow.test');
  for (const id of MALFORMED) {
    for (const intent of ['cancel', 'remove', 'role']) {
      const response = await owner.post('/app/setup/team', { form: { intent, id, role: 'sales' }, maxRedirects: 0 });
      expect(response.status(), `${intent} ${id}`).toBe(404);
    }
    expect((await owner.get(`/app/leads/${id}`)).status(), `lead page ${id}`).toBe(404);
    expect((await owner.delete(`/api/app/team/invites/${id}`)).status(), `invite ${id}`).toBe(404);
    expect((await owner.delete(`/api/app/leads/${id}`)).status(), `delete lead ${id}`).toBe(404);
    expect((await owner.post(`/api/app/leads/${id}/restore`)).status(), `restore lead ${id}`).toBe(404);
    expect((await owner.post(`/api/app/leads/${id}/merge`, { data: { into: id } })).status(), `merge lead ${id}`).toBe(404);
  }
  await owner.dispose();
});
