import { readdirSync } from 'node:fs';
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import globals from 'globals';
import importX from 'eslint-plugin-import-x';
import { createTypeScriptImportResolver } from 'eslint-import-resolver-typescript';
import reactHooks from 'eslint-plugin-react-hooks';
import checkFile from 'eslint-plugin-check-file';

// Layer boundaries: the domain imports no framework; the apps never import each other.
const frameworks = [
  'express',
  'express-*',
  'knex',
  'mysql2',
  'react',
  'react-*',
  'react-dom',
  '@tanstack/*',
  'bullmq',
  'ioredis',
  'nodemailer',
  'argon2',
  'node:*',
  'vite',
];
const restrict = (patterns: { group: string[]; message: string }[]) => ({
  'no-restricted-imports': ['error', { patterns }] as ['error', { patterns: typeof patterns }],
});

// bulletproof-react's zones: a feature never imports another; shared components/ and lib/ import no feature.
const webFeatures = readdirSync(new URL('./apps/web/src/features', import.meta.url), { withFileTypes: true })
  .filter((d) => d.isDirectory())
  .map((d) => d.name);
const featureZones = [
  ...webFeatures.map((feature) => ({
    target: `./apps/web/src/features/${feature}`,
    from: './apps/web/src/features',
    except: [`./${feature}`],
    message:
      'Features never import each other: compose them in a page under app/routes, or share through components/ or lib/.',
  })),
  {
    target: ['./apps/web/src/components', './apps/web/src/lib'],
    from: ['./apps/web/src/features', './apps/web/src/app'],
    message: 'components/ and lib/ are shared by every feature, so they import none.',
  },
];

// SQL lives only in *-dal.ts: a table call (db('jobs'), trx('jobs'), deps.db('jobs')) or a raw query anywhere else is refused.
const sqlOutsideDal = [
  {
    selector: "CallExpression[callee.type='Identifier'][callee.name=/^(db|trx|knex|tx)$/]",
    message: 'SQL lives in *-dal.ts only: call a data-access function.',
  },
  {
    selector: "CallExpression[callee.type='MemberExpression'][callee.property.name='db']",
    message: 'SQL lives in *-dal.ts only: call a data-access function.',
  },
  {
    selector: "CallExpression[callee.type='MemberExpression'][callee.property.name='raw']",
    message: 'SQL lives in *-dal.ts only: call a data-access function.',
  },
];

export default tseslint.config(
  {
    ignores: [
      'dist/**',
      'apps/api/dist/**',
      'apps/api/dist-test-*/**',
      'dist-slot-*/**',
      'node_modules/**',
      '.data/**',
      'test-results/**',
      'playwright-report/**',
      'bench/results/**',
    ],
  },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/no-non-null-assertion': 'off',
    },
  },
  {
    files: ['**/*.{ts,tsx}'],
    plugins: { 'import-x': importX, 'check-file': checkFile },
    settings: {
      // Without these, import-x reads no TypeScript file it follows, and no-cycle sees no cycle.
      'import-x/extensions': ['.ts', '.tsx'],
      'import-x/parsers': { '@typescript-eslint/parser': ['.ts', '.tsx'] },
      'import-x/resolver-next': [
        createTypeScriptImportResolver({
          project: [
            'apps/web/tsconfig.json',
            'apps/api/tsconfig.json',
            'packages/domain/tsconfig.json',
            'tsconfig.tools.json',
          ],
          noWarnOnMultipleProjects: true,
        }),
      ],
    },
    rules: {
      'import-x/no-cycle': ['error', { ignoreExternal: true }],
      // Migrations keep Knex's timestamp_ prefix; everything else is kebab-case.
      'check-file/filename-naming-convention': [
        'error',
        { '{apps,packages,tests}/**/*.{ts,tsx}': 'KEBAB_CASE' },
        { ignoreMiddleExtensions: true },
      ],
      'check-file/folder-naming-convention': ['error', { '{apps,packages,tests}/**/': 'KEBAB_CASE' }],
    },
  },
  {
    files: ['apps/api/src/**/*.ts'],
    ignores: ['**/*-dal.ts', 'apps/api/src/db/**'],
    rules: { 'no-restricted-syntax': ['error', ...sqlOutsideDal] },
  },
  {
    files: ['packages/domain/**/*.ts'],
    rules: restrict([
      {
        group: frameworks,
        message:
          'packages/domain holds zod schemas, pure calculations and CASL rules only: no framework or Node imports.',
      },
      {
        group: ['@heatfleet/api', '@heatfleet/api/*', '@heatfleet/web', '@heatfleet/web/*', '**/apps/**'],
        message: 'The domain never imports an app.',
      },
    ]),
  },
  {
    files: ['apps/api/**/*.ts'],
    rules: restrict([
      {
        group: ['@heatfleet/web', '@heatfleet/web/*', '**/apps/web/**', '@/*'],
        message: 'The API never imports the web app.',
      },
      { group: ['../../../*'], message: 'Import from the module folder, not three levels up.' },
    ]),
  },
  {
    files: ['apps/web/src/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    rules: {
      'import-x/no-restricted-paths': ['error', { zones: featureZones }],
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'error',
    },
  },
  {
    files: ['apps/web/**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser } },
    rules: restrict([
      {
        group: [
          '@heatfleet/api',
          '@heatfleet/api/*',
          '**/apps/api/**',
          'knex',
          'express',
          'mysql2',
          'argon2',
          'node:*',
        ],
        message: 'The web app never imports the API or server-only packages; share through packages/domain.',
      },
      { group: ['../../../*'], message: 'Use the @/ alias instead of long relative paths.' },
    ]),
  },
);
