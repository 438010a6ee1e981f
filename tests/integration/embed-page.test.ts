import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { experimental_AstroContainer as AstroContainer } from 'astro/container';
import type { MikroORM } from '@mikro-orm/postgresql';
import EmbedPage from '../../src/pages/embed/[slug].astro';
import { Company } from '../../src/lib/server/companies/company.entity';
import { openOrm } from '../../src/lib/server/boot/orm';
import { createThrowawayDatabase } from '../helpers/database';

/**
 * The widget's page for a firm that gives no estimates online. It renders the page itself (Astro's
 * container) on a throwaway database, where a test may break what a firm's rates are read from.
 */
describe('the embed page', () => {
  let orm: MikroORM;
  let drop: () => Promise<void>;
  let container: AstroContainer;

  beforeAll(async () => {
    const database = await createThrowawayDatabase();
    drop = database.drop;
    orm = await openOrm(database.url);
    await orm.migrator.up();
    const em = orm.em.fork();
    // Two firms, because a firm's published rates (or their absence) are cached for a few seconds.
    em.create(Company, { slug: 'no-rates-yet', name: 'Quiet Lake Carpentry' });
    em.create(Company, { slug: 'rates-unreadable', name: 'Birch Row Interiors' });
    await em.flush();
    // The page adds its frame-ancestors to Astro's own policy, so the container needs that policy on, as the app has it.
    const csp = {
      cspDestination: 'header',
      algorithm: 'SHA-256',
      scriptHashes: [],
      scriptResources: [],
      isStrictDynamic: false,
      styleHashes: [],
      styleResources: [],
      directives: [],
    };
    container = await AstroContainer.create({
      manifest: { csp } as unknown as Parameters<typeof AstroContainer.create>[0] extends infer O ? (O extends { manifest?: infer M } ? M : never) : never,
    });
  });

  afterAll(async () => {
    await orm?.close(true);
    await drop?.();
  });

  // The widget's page runs outside the session middleware: nobody is signed in.
  const locals = (): App.Locals => ({ em: orm.em.fork(), user: null, session: null, membership: null, memberships: [] });
  const render = (slug: string) => container.renderToString(EmbedPage, { params: { slug }, locals: locals() });

  test('a firm without published rates gets the "not taking online estimates" notice', async () => {
    expect(await render('no-rates-yet')).toContain('Quiet Lake Carpentry is not taking online estimates right now.');
  });

  test('any other failure to read the rates is thrown on, never shown as that notice', async () => {
    await orm.em.getConnection().execute('alter table rate_book_version rename to rate_book_version_away');
    try {
      await expect(render('rates-unreadable')).rejects.toThrow(/rate_book_version/);
    } finally {
      await orm.em.getConnection().execute('alter table rate_book_version_away rename to rate_book_version');
    }
  });
});
