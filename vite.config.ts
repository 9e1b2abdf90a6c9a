import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

const repoRoot = fileURLToPath(new URL('.', import.meta.url));

export default defineConfig({
  root: repoRoot,
  publicDir: 'apps/web/public',
  plugins: [react(), tailwindcss()],
  resolve: {
    alias: { '@': fileURLToPath(new URL('./apps/web/src', import.meta.url)) },
  },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    // The API serves dist/ under a strict CSP; an inlined asset would become a data: URL the CSP refuses.
    assetsInlineLimit: 0,
  },
  server: {
    port: Number(process.env.PORT ?? 5173),
    strictPort: true,
    // The stack's data and the test reports change while the dev server runs; none of it is source.
    watch: { ignored: ['**/.data/**', '**/dist/**', '**/test-results/**'] },
    proxy: {
      '/api': { target: process.env.API_PROXY_TARGET ?? 'http://127.0.0.1:5174', changeOrigin: false },
    },
  },
  // Vitest, run by `npm test` with the test stack's environment (packages/devstack/src/test.ts).
  test: {
    projects: [
      { extends: true, test: { name: 'domain', include: ['packages/domain/**/*.test.ts'], environment: 'node' } },
      { extends: true, test: { name: 'devstack', include: ['packages/devstack/**/*.test.ts'], environment: 'node' } },
      // The client's own logic (forms, drafts, formatting): plain functions, so no browser is needed.
      { extends: true, test: { name: 'web', include: ['apps/web/**/*.test.ts'], environment: 'node' } },
      {
        extends: true,
        test: {
          name: 'api',
          include: ['apps/api/**/*.test.ts', 'tests/api/**/*.test.ts'],
          environment: 'node',
          testTimeout: 30_000,
          hookTimeout: 90_000,
        },
      },
    ],
  },
});
