// ESLint: bugs and the layering of the code, nothing about formatting (that is Prettier's job).
// `npm run lint` runs this and `prettier --check .`; the layer rules are explained in DEVELOPERS.md.
import js from '@eslint/js';
import { defineConfig } from 'eslint/config';
import tseslint from 'typescript-eslint';
import { importX } from 'eslint-plugin-import-x';
import { createTypeScriptImportResolver } from 'eslint-import-resolver-typescript';
import astroParser from 'astro-eslint-parser';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';

// ---------------------------------------------------------------------------------------------
// The layers inside src/lib/server, lowest first. A unit is `src/lib/server/<name>.ts` or the
// folder `src/lib/server/<name>/`; it may import itself and the units in its list, nothing else
// in src/lib/server. A list may name only units above it in this table, so units can never import
// each other in a circle. A new folder is one line here (lint fails until it has one).

const FOUNDATION = ['config', 'clock', 'time', 'log', 'after-response', 'unavailable', 'errors', 'request-id', 'http', 'form-failure', 'viewer'];
const BELOW_DOMAINS = [...FOUNDATION, 'db', 'rate-limit'];
const DOMAINS_BELOW_AUTH = [...BELOW_DOMAINS, 'companies', 'jobs', 'users', 'mail', 'storage', 'rates'];
const BELOW_VISITS = [...DOMAINS_BELOW_AUTH, 'auth', 'estimates', 'leads', 'team'];
const BELOW_PHOTOS = [...BELOW_VISITS, 'visits'];
const BELOW_BOOT = [...BELOW_PHOTOS, 'photos', 'embed', 'intake', 'rate-preview', 'reports'];

/** @type {[unit: string, mayImport: string[]][]} */
const SERVER_LAYERS = [
  ['config', []],
  ['clock', []],
  ['time', ['clock']],
  ['log', ['config']],
  // Work a request starts without waiting for it (so its timing cannot show anything).
  ['after-response', ['log']],
  // Tells an outage of the database (or another server) from a fault in our code.
  ['unavailable', []],
  ['errors', ['log', 'unavailable']],
  ['request-id', []],
  ['http', ['errors']],
  ['form-failure', ['errors', 'http']],
  // Who is looking (role, firm), for every domain's policy.
  ['viewer', []],
  ['db', FOUNDATION],
  // Counters in PostgreSQL, through the ORM's own pool.
  ['rate-limit', [...FOUNDATION, 'db']],
  ['companies', BELOW_DOMAINS],
  // The job runner: low, so that mail and other domains can hand it work.
  ['jobs', BELOW_DOMAINS],
  ['users', [...BELOW_DOMAINS, 'companies']],
  ['mail', [...BELOW_DOMAINS, 'companies', 'jobs']],
  ['storage', [...BELOW_DOMAINS, 'companies']],
  ['rates', [...BELOW_DOMAINS, 'companies', 'users']],
  ['auth', DOMAINS_BELOW_AUTH],
  ['estimates', DOMAINS_BELOW_AUTH],
  ['leads', [...DOMAINS_BELOW_AUTH, 'auth', 'estimates']],
  ['team', [...DOMAINS_BELOW_AUTH, 'auth', 'estimates']],
  // Site visits: availability, open slots, booking, invitations and reminders.
  ['visits', BELOW_VISITS],
  ['photos', BELOW_PHOTOS],
  ['embed', [...BELOW_PHOTOS, 'photos']],
  // Inquiries coming in and kept tidy: staff-entered inquiries, merging, purging deleted ones, the morning digest.
  ['intake', [...BELOW_PHOTOS, 'photos']],
  // What a Rate book draft would do: sample rooms and recent inquiries priced with it beside the published version.
  ['rate-preview', BELOW_PHOTOS],
  // The owner's Reports: read-only figures over leads, visits and the widget's funnel.
  ['reports', [...BELOW_PHOTOS, 'photos', 'embed', 'intake']],
  // Middleware pieces (glue for src/middleware.ts).
  ['request-log', BELOW_BOOT],
  ['failures', BELOW_BOOT],
  ['security-headers', BELOW_BOOT],
  // The list of every entity and the ORM built from it: above every domain, imported by none.
  ['boot', BELOW_BOOT],
  ['demo-data', [...BELOW_BOOT, 'boot']],
];

const SERVER = 'src/lib/server';
const unitPaths = (unit) => [`${SERVER}/${unit}.ts`, `${SERVER}/${unit}.test.ts`, `${SERVER}/${unit}`];

function checkLayerTable() {
  const seen = new Set();
  for (const [unit, mayImport] of SERVER_LAYERS) {
    for (const lower of mayImport) {
      if (!seen.has(lower)) throw new Error(`eslint.config.js: ${unit} may import "${lower}", which is not listed above it in SERVER_LAYERS.`);
    }
    if (seen.has(unit)) throw new Error(`eslint.config.js: ${unit} has two lines in SERVER_LAYERS.`);
    seen.add(unit);
  }
}
checkLayerTable();

/** Reports a file of src/lib/server whose unit has no line in SERVER_LAYERS (so no layer rule would cover it). */
const layerListed = {
  meta: { type: 'problem', schema: [], messages: { unlisted: '{{unit}} has no line in SERVER_LAYERS (eslint.config.js): add one saying what it may import.' } },
  create(context) {
    const relative = context.filename.slice(context.cwd.length + 1).replaceAll('\\', '/');
    const unit = relative
      .slice(SERVER.length + 1)
      .split('/')[0]
      .replace(/(\.test)?\.tsx?$/, '');
    const listed = SERVER_LAYERS.some(([name]) => name === unit);
    return {
      Program(node) {
        if (!listed && !/\.d\.ts$/.test(relative)) context.report({ node, messageId: 'unlisted', data: { unit: `${SERVER}/${unit}` } });
      },
    };
  },
};

const serverZones = SERVER_LAYERS.map(([unit, mayImport]) => ({
  target: unitPaths(unit),
  from: SERVER_LAYERS.filter(([other]) => other !== unit && !mayImport.includes(other)).flatMap(([other]) => unitPaths(other)),
  message: `${SERVER}/${unit} may import only ${mayImport.length ? mayImport.join(', ') : 'nothing else'} in ${SERVER} (SERVER_LAYERS in eslint.config.js).`,
})).filter((zone) => zone.from.length > 0);

// Pages and middleware are the glue: they may import anything, and nothing in src/lib,
// src/components or src/layouts may import them.
const GLUE = ['src/pages', 'src/middleware.ts'];

const boundaryZones = [
  {
    target: 'src/lib/estimate',
    from: ['src/lib/server', 'src/lib/shared', 'src/components', 'src/layouts', ...GLUE],
    message: 'The estimating core imports only itself, zod and node built-ins.',
  },
  {
    target: 'src/lib/visits',
    from: ['src/lib/server', 'src/lib/shared', 'src/lib/estimate', 'src/components', 'src/layouts', ...GLUE],
    message: 'The visit-scheduling core imports only itself, date-fns, @date-fns/tz, ics and zod.',
  },
  {
    target: 'src/lib/shared',
    from: ['src/lib/server', 'src/components', 'src/layouts', ...GLUE],
    message: 'src/lib/shared is safe for islands and server: it imports only the estimating core and itself.',
  },
  {
    // Islands run in the browser. (.astro components and layouts render on the server only.)
    target: ['src/components/**/*.ts', 'src/components/**/*.tsx'],
    from: ['src/lib/server', ...GLUE],
    message: 'Islands never import server code (they run in the browser): let the page pass what they need.',
  },
  { target: ['src/components', 'src/layouts'], from: GLUE, message: 'Components and layouts never import pages or middleware.' },
  { target: 'src/lib/server', from: ['src/components', 'src/layouts', ...GLUE], message: 'Server code never imports pages, components or layouts.' },
  ...serverZones,
];

// ---------------------------------------------------------------------------------------------

const TS = ['**/*.ts', '**/*.tsx', '**/*.mts'];
const JS = ['**/*.js', '**/*.mjs'];
const TESTS = ['**/*.test.ts', '**/*.test.tsx', 'tests/**', 'bench/**'];

export default defineConfig(
  {
    ignores: ['dist/', '.astro/', '.data/', 'node_modules/', 'public/', 'test-results/', 'playwright-report/', 'bench/results/', 'migrations/'],
  },
  {
    linterOptions: { reportUnusedDisableDirectives: 'error' },
  },
  js.configs.recommended,
  tseslint.configs.recommended,
  {
    files: [...TS, ...JS, '**/*.astro'],
    languageOptions: { globals: { ...globals.node } },
    plugins: { 'import-x': importX, lapwing: { rules: { 'layer-listed': layerListed } } },
    settings: {
      'import-x/resolver-next': [createTypeScriptImportResolver({ project: './tsconfig.json', alwaysTryTypes: true })],
      'import-x/extensions': ['.ts', '.tsx', '.mts', '.js', '.mjs', '.astro'],
      // Modules reached by following imports are parsed as TypeScript, also from an .astro file.
      'import-x/parsers': { '@typescript-eslint/parser': ['.ts', '.tsx', '.mts', '.js', '.mjs'] },
      // .astro files are not parsed when following imports (no-cycle): no .ts module imports one.
      'import-x/ignore': ['\\.astro$', 'node_modules'],
    },
    rules: {
      'import-x/no-cycle': ['error', { ignoreExternal: true }],
      'import-x/no-self-import': 'error',
      'import-x/no-restricted-paths': ['error', { zones: boundaryZones }],
      // Unused names are mistakes or leftovers; `_name` marks one kept on purpose.
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none', ignoreRestSiblings: true }],
    },
  },
  {
    files: ['src/lib/server/**'],
    rules: { 'lapwing/layer-listed': 'error' },
  },
  {
    // What the app imports at run time must be a declared dependency, not a devDependency or a
    // package that happens to be installed because something else needs it.
    files: ['src/**'],
    // Build-time code (it bundles the estimate worker with esbuild during `astro build` and in development).
    ignores: [...TESTS, 'src/lib/server/estimates/worker-bundle.ts'],
    rules: { 'import-x/no-extraneous-dependencies': ['error', { devDependencies: false, includeTypes: false }] },
  },
  {
    // A promise nobody awaits loses its errors (an un-awaited flush, a rejected send): the few
    // type-aware rules that catch that. They need type information, so they cost most of the run.
    files: TS,
    languageOptions: { parserOptions: { projectService: true, tsconfigRootDir: import.meta.dirname } },
    rules: {
      '@typescript-eslint/no-floating-promises': 'error',
      '@typescript-eslint/no-misused-promises': ['error', { checksVoidReturn: { attributes: false } }],
      '@typescript-eslint/await-thenable': 'error',
    },
  },
  {
    // The estimating core: no framework, no database, nothing but zod and node built-ins.
    files: ['src/lib/estimate/**'],
    ignores: TESTS,
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              // Paths inside the project (relative or ~/) are judged by the zones above.
              regex: '^(?!(?:zod(?:/.*)?|node:.+|\\.{1,2}/.*|~/.*)$)',
              message: 'The estimating core imports only itself, zod and node: built-ins (src/lib/estimate/).',
            },
          ],
        },
      ],
    },
  },
  {
    // The visit-scheduling core: pure, like the estimating core; zone arithmetic through date-fns.
    files: ['src/lib/visits/**'],
    ignores: TESTS,
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              // Paths inside the project (relative or ~/) are judged by the zones above.
              regex: '^(?!(?:zod(?:/.*)?|date-fns(?:/.*)?|@date-fns/tz(?:/.*)?|ics|\\.{1,2}/.*|~/.*)$)',
              message: 'The visit-scheduling core imports only itself, date-fns, @date-fns/tz, ics and zod (src/lib/visits/).',
            },
          ],
        },
      ],
    },
  },
  {
    // Shared schemas and labels: loaded by islands in the browser too.
    files: ['src/lib/shared/**'],
    ignores: TESTS,
    rules: {
      'import-x/no-nodejs-modules': 'error',
      'no-restricted-imports': [
        'error',
        { patterns: [{ group: ['astro', 'astro:*', 'astro/*', '@mikro-orm/*'], message: 'src/lib/shared must run in the browser and on the server alike.' }] },
      ],
    },
  },
  {
    files: ['src/components/**/*.tsx', 'src/components/**/*.ts', 'widget/loader.ts'],
    languageOptions: { globals: { ...globals.browser } },
  },
  {
    files: ['src/**/*.tsx'],
    plugins: { 'react-hooks': reactHooks },
    rules: {
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'error',
    },
  },
  {
    files: ['**/*.astro'],
    languageOptions: {
      parser: astroParser,
      parserOptions: { parser: tseslint.parser, extraFileExtensions: ['.astro'], sourceType: 'module' },
      globals: { ...globals.node, ...globals.browser },
    },
  },
  {
    // Astro's own way to load the generated types of astro: modules.
    files: ['src/env.d.ts'],
    rules: { '@typescript-eslint/triple-slash-reference': 'off' },
  },
  {
    files: TESTS,
    rules: {
      // Tests read answers of routes they call as loosely typed JSON.
      '@typescript-eslint/no-explicit-any': 'off',
    },
  },
);
