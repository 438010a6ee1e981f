import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { UniqueConstraintViolationException } from '@mikro-orm/core';
import type { MikroORM } from '@mikro-orm/postgresql';
import { getOrm } from '../../src/lib/server/boot/orm';
import { buildFirm } from '../helpers/accounts';
import { buildRateBookVersion } from '../helpers/factories';

let orm: MikroORM;
beforeAll(async () => {
  orm = await getOrm();
});
afterAll(async () => {
  await orm.close();
});

describe('rate book versions', () => {
  test('a firm has at most one published version: the database refuses a second one', async () => {
    const em = orm.em.fork();
    const { company } = await buildFirm(em, []);
    buildRateBookVersion(em, company.id, { status: 'published', number: 1 });
    buildRateBookVersion(em, company.id, { status: 'draft', number: 2 });
    await em.flush();

    const racing = orm.em.fork();
    buildRateBookVersion(racing, company.id, { status: 'published', number: 3 });
    await expect(racing.flush()).rejects.toBeInstanceOf(UniqueConstraintViolationException);
  });
});
