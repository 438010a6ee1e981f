/**
 * A costly estimate must never hold up anyone else: the reported request (20 rooms × 16 walls × 16
 * openings of 100 ft walls in full-height shiplap) is refused at once with its fields named, and the
 * heaviest project still accepted is worked out off the event loop while other requests go on being
 * answered. Real endpoints, real PostgreSQL, the real worker pool.
 */
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { MikroORM } from '@mikro-orm/postgresql';
import { costliestAcceptedProject, schemaMaximumProject } from '../../src/lib/estimate/sample-big-projects';
import { getOrm } from '../../src/lib/server/boot/orm';
import { Company } from '../../src/lib/server/companies/company.entity';
import { issueFormToken } from '../../src/lib/server/embed/form-token';
import { closeEstimatePool } from '../../src/lib/server/estimates/estimate-pool';
import { POST as estimateRoute } from '../../src/pages/api/embed/[slug]/estimate';
import { POST as leadsRoute } from '../../src/pages/api/embed/[slug]/leads';
import { GET as healthRoute } from '../../src/pages/api/health';
import { callRoute } from '../helpers/api-route';

let orm: MikroORM;
let cedar: Company;
let addressCounter = 0;
// Each test its own documentation address (RFC 5737), so per-address limits do not meet.
const address = () => `198.51.100.${++addressCounter}`;

beforeAll(async () => {
  orm = await getOrm();
  cedar = await orm.em.fork().findOneOrFail(Company, { slug: 'cedar-hollow' });
});
afterAll(async () => {
  await closeEstimatePool();
  await orm.close();
});

const askEstimate = (project: unknown, clientAddress = address()) =>
  callRoute(estimateRoute, {
    method: 'POST',
    path: '/api/embed/cedar-hollow/estimate',
    params: { slug: 'cedar-hollow' },
    em: orm.em.fork(),
    body: { formToken: issueFormToken(cedar.id).token, project },
    clientAddress,
  });
const health = () => callRoute(healthRoute, { method: 'GET', path: '/api/health', params: {}, em: orm.em.fork() });

describe('a costly estimate request', () => {
  test('the reported request is refused with 400 and the fields that are too big', async () => {
    const response = await askEstimate(schemaMaximumProject());
    expect(response.status).toBe(400);
    const body = (await response.json()) as { error: string; fields: Record<string, string> };
    expect(body.error).toBe('This project is too big for one online estimate.');
    expect(body.fields['project.rooms']).toMatch(/320 walls \(at most 120\)/);
    expect(body.fields['project.rooms.0.walls']).toMatch(/sq ft; an online estimate takes at most/);
  });

  test('the same project sent as an inquiry is refused the same way, and stores nothing', async () => {
    const response = await callRoute(leadsRoute, {
      method: 'POST',
      path: '/api/embed/cedar-hollow/leads',
      params: { slug: 'cedar-hollow' },
      em: orm.em.fork(),
      body: {
        formToken: issueFormToken(cedar.id, Date.now() - 60_000).token,
        idempotencyKey: randomUUID(),
        project: schemaMaximumProject(),
        contact: {
          name: 'Ada Greenleaf',
          email: 'ada@example.test',
          phone: '(512) 555-0161',
          address: '27 Tanager St',
          postcode: '78704',
          preferredContact: 'email',
          consent: true,
        },
      },
      clientAddress: address(),
    });
    expect(response.status).toBe(400);
    expect(((await response.json()) as { fields: Record<string, string> }).fields['project.rooms']).toMatch(/too big/);
  });

  test('while the costliest accepted estimate is being worked out, the server goes on answering', async () => {
    await askEstimate({ ...costliestAcceptedProject(), rooms: costliestAcceptedProject().rooms.slice(0, 1) }); // the pool is up
    const order: string[] = [];
    const heavy = askEstimate(costliestAcceptedProject()).then((response) => {
      order.push('heavy estimate');
      return response;
    });
    // Health checks one after another, as a load balancer would send them. On the event loop the
    // estimate holds them all up from the moment it starts; off it, they are all answered first.
    for (let i = 0; i < 20; i++) {
      const response = await health();
      expect(response.status).toBe(200);
      order.push('health');
    }
    const response = await heavy;
    expect(response.status).toBe(200);
    expect(order).toEqual([...Array<string>(20).fill('health'), 'heavy estimate']);
    const view = (await response.json()) as { estimate: { rooms: Array<{ walls: Array<{ drawn: boolean }> }> } };
    expect(view.estimate.rooms).toHaveLength(20);
  });
});
