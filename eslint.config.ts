import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import globals from 'globals';

// Layer boundaries: the domain imports no framework; the apps never import each other.
const frameworks = ['express', 'express-*', 'knex', 'mysql2', 'react', 'react-*', 'react-dom', '@tanstack/*', 'bullmq', 'ioredis', 'nodemailer', 'argon2', 'node:*', 'vite'];
const restrict = (patterns: { group: string[]; message: string }[]) => ({
  'no-restricted-imports': ['error', { patterns }] as ['error', { patterns: typeof patterns }],
});

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', '.data/**', 'test-results/**', 'playwright-report/**', 'bench/results/**'] },
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
    files: ['packages/domain/**/*.ts'],
    rules: restrict([
      { group: frameworks, message: 'packages/domain holds zod schemas, pure calculations and CASL rules only: no framework or Node imports.' },
      { group: ['@heatfleet/api', '@heatfleet/api/*', '@heatfleet/web', '@heatfleet/web/*', '**/apps/**'], message: 'The domain never imports an app.' },
    ]),
  },
  {
    files: ['apps/api/**/*.ts'],
    rules: restrict([
      { group: ['@heatfleet/web', '@heatfleet/web/*', '**/apps/web/**', '@/*'], message: 'The API never imports the web app.' },
      { group: ['../../../*'], message: 'Import from the module folder, not three levels up.' },
    ]),
  },
  {
    files: ['apps/web/**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser } },
    rules: restrict([
      { group: ['@heatfleet/api', '@heatfleet/api/*', '**/apps/api/**', 'knex', 'express', 'mysql2', 'argon2', 'node:*'], message: 'The web app never imports the API or server-only packages; share through packages/domain.' },
      { group: ['../../../*'], message: 'Use the @/ alias instead of long relative paths.' },
    ]),
  },
);
