/**
 * The layer rules in eslint.config.js, checked on small made-up modules placed in each layer:
 * each forbidden import is reported, each allowed one is not.
 * Source: the layer table in DEVELOPERS.md ("Layers"), which eslint.config.js encodes.
 */
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ESLint } from 'eslint';
import { describe, expect, test } from 'vitest';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

// Only the layer rules matter here; the type-aware rules need files that exist on disk, and
// no-cycle would read half the code base for each snippet.
const eslint = new ESLint({
  cwd: root,
  overrideConfig: {
    files: ['**/*.ts', '**/*.tsx'],
    languageOptions: { parserOptions: { projectService: false } },
    rules: {
      '@typescript-eslint/no-floating-promises': 'off',
      '@typescript-eslint/no-misused-promises': 'off',
      '@typescript-eslint/await-thenable': 'off',
      '@typescript-eslint/no-unused-vars': 'off',
      'import-x/no-cycle': 'off',
    },
  },
});

/** The rules a module at `file` with these imports breaks (empty when it breaks none). */
async function broken(file: string, ...imports: string[]): Promise<string[]> {
  const code = imports.map((from, i) => `import * as m${i} from '${from}';\nexport const x${i} = m${i};\n`).join('');
  const [result] = await eslint.lintText(code, { filePath: path.join(root, file) });
  return [...new Set(result!.messages.map((m) => m.ruleId ?? m.message))];
}

const LAYER = ['import-x/no-restricted-paths'];

describe('the estimating core', () => {
  test('imports itself, zod and node built-ins', async () => {
    expect(await broken('src/lib/estimate/zz-new.ts', './units', '~/lib/estimate/money', 'zod', 'node:crypto')).toEqual([]);
  });
  test('imports no framework, database, server, shared or component code', async () => {
    expect(await broken('src/lib/estimate/zz-new.ts', 'react')).toEqual(['no-restricted-imports']);
    expect(await broken('src/lib/estimate/zz-new.ts', 'astro')).toEqual(['no-restricted-imports']);
    expect(await broken('src/lib/estimate/zz-new.ts', '@mikro-orm/core')).toEqual(['no-restricted-imports']);
    expect(await broken('src/lib/estimate/zz-new.ts', '~/lib/server/config')).toEqual(LAYER);
    expect(await broken('src/lib/estimate/zz-new.ts', '../shared/labels')).toEqual(LAYER);
    expect(await broken('src/lib/estimate/zz-new.ts', '~/components/forms/LengthField')).toEqual(LAYER);
  });
});

describe('the visit-scheduling core', () => {
  test('imports itself, date-fns, @date-fns/tz, ics and zod', async () => {
    expect(await broken('src/lib/visits/zz-new.ts', './slots', '~/lib/visits/local-time', 'date-fns', '@date-fns/tz', 'ics', 'zod')).toEqual([]);
  });
  test('imports no framework, database, server, shared, estimate or component code', async () => {
    expect(await broken('src/lib/visits/zz-new.ts', 'react')).toEqual(['no-restricted-imports']);
    expect(await broken('src/lib/visits/zz-new.ts', '@mikro-orm/core')).toEqual(['no-restricted-imports']);
    expect(await broken('src/lib/visits/zz-new.ts', 'node:fs')).toEqual(['no-restricted-imports']);
    expect(await broken('src/lib/visits/zz-new.ts', '~/lib/server/clock')).toEqual(LAYER);
    expect(await broken('src/lib/visits/zz-new.ts', '../shared/time')).toEqual(LAYER);
    expect(await broken('src/lib/visits/zz-new.ts', '~/lib/estimate/index.ts')).toEqual(LAYER);
    expect(await broken('src/lib/visits/zz-new.ts', '~/components/forms/LengthField')).toEqual(LAYER);
  });
  test('shared and server code may import it', async () => {
    expect(await broken('src/lib/shared/zz-new.ts', '~/lib/visits/index.ts')).toEqual([]);
    expect(await broken('src/lib/server/leads/zz-new.ts', '~/lib/visits/index.ts')).toEqual([]);
  });
});

describe('shared schemas and labels', () => {
  test('import the core, themselves and zod', async () => {
    expect(await broken('src/lib/shared/zz-new.ts', '~/lib/estimate/index.ts', './labels', 'zod')).toEqual([]);
  });
  test('import no server code, node built-ins, ORM or astro', async () => {
    expect(await broken('src/lib/shared/zz-new.ts', '~/lib/server/errors')).toEqual(LAYER);
    expect(await broken('src/lib/shared/zz-new.ts', 'node:fs')).toEqual(['import-x/no-nodejs-modules']);
    expect(await broken('src/lib/shared/zz-new.ts', '@mikro-orm/core')).toEqual(['no-restricted-imports']);
    expect(await broken('src/lib/shared/zz-new.ts', 'astro:middleware')).toEqual(['no-restricted-imports']);
  });
});

describe('components and layouts', () => {
  test('islands never import server code', async () => {
    expect(await broken('src/components/widget/ZzNew.tsx', '~/lib/shared/labels', '~/lib/estimate/index.ts')).toEqual([]);
    expect(await broken('src/components/widget/ZzNew.tsx', '~/lib/server/config')).toEqual(LAYER);
    expect(await broken('src/components/widget/zz-new.ts', '../../lib/server/team/team.service')).toEqual(LAYER);
  });
  test('.astro files render on the server only: they may use server code, never the pages', async () => {
    const lint = async (body: string) => {
      const [result] = await eslint.lintText(`---\n${body}\n---\n<p>{String(x)}</p>\n`, { filePath: path.join(root, 'src/layouts/ZzNew.astro') });
      return result!.messages.map((m) => m.ruleId);
    };
    expect(await lint(`import { config as x } from '~/lib/server/config';`)).toEqual([]);
    expect(await lint(`import { onRequest as x } from '~/middleware';`)).toEqual(LAYER);
  });
});

describe('inside src/lib/server', () => {
  test('a folder imports folders below it', async () => {
    expect(
      await broken(
        'src/lib/server/leads/zz-new.ts',
        '../db/base.entity',
        '../companies/company.entity',
        '../mail/outbox',
        '../estimates/estimate.service',
        '../config',
      ),
    ).toEqual([]);
    expect(await broken('src/lib/server/embed/zz-new.ts', '../photos/lead-photo.service', '../leads/lead.service')).toEqual([]);
  });
  test('never folders above it or beside it', async () => {
    expect(await broken('src/lib/server/db/zz-new.ts', '../companies/company.entity')).toEqual(LAYER);
    expect(await broken('src/lib/server/companies/zz-new.ts', '../users/user.entity')).toEqual(LAYER);
    expect(await broken('src/lib/server/mail/zz-new.ts', '../users/user.entity')).toEqual(LAYER);
    expect(await broken('src/lib/server/auth/zz-new.ts', '../estimates/estimate.service')).toEqual(LAYER);
    expect(await broken('src/lib/server/photos/zz-new.ts', '../embed/form-token')).toEqual(LAYER);
    expect(await broken('src/lib/server/config.ts', './db/base.entity')).toEqual(LAYER);
  });
  test('boot/ (every entity and the ORM) is imported by no domain; demo-data/ may use it', async () => {
    expect(await broken('src/lib/server/embed/zz-new.ts', '../boot/orm')).toEqual(LAYER);
    expect(await broken('src/lib/server/db/zz-new.ts', '~/lib/server/boot/entities')).toEqual(LAYER);
    expect(await broken('src/lib/server/demo-data/zz-new.ts', '../boot/orm', '../embed/form-token')).toEqual([]);
    expect(await broken('src/lib/server/boot/zz-new.ts', '../demo-data/demo')).toEqual(LAYER);
  });
  test('server code never imports pages, components or layouts', async () => {
    expect(await broken('src/lib/server/leads/zz-new.ts', '~/components/widget/draft')).toEqual(LAYER);
  });
  test('a folder without a line in the table is reported', async () => {
    expect(await broken('src/lib/server/zz-unlisted/thing.ts', '../config')).toEqual(['lapwing/layer-listed']);
  });
});
