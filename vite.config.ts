import { execFileSync } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Plugin } from 'vite';
import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { VitePWA } from 'vite-plugin-pwa';

const repoRoot = fileURLToPath(new URL('.', import.meta.url));

// Installable and usable without signal (README, Working offline): the web app manifest and our service worker
// (apps/web/sw), built with Workbox's precache manifest of the app shell. A new version is offered in the app,
// never applied by itself, so registration is the app's (apps/web/src/lib/offline/app-update.ts).
const pwa = VitePWA({
  strategies: 'injectManifest',
  srcDir: 'apps/web/sw',
  filename: 'service-worker.ts',
  registerType: 'prompt',
  injectRegister: false,
  manifest: {
    id: '/',
    name: 'Heatfleet',
    short_name: 'Heatfleet',
    description: 'Vans, cleaning kits, chemical stock and jobs for heating firms.',
    lang: 'en-GB',
    start_url: '/',
    scope: '/',
    display: 'standalone',
    orientation: 'portrait',
    // The theme's brand-900 and canvas (apps/web/src/index.css).
    theme_color: '#0c3236',
    background_color: '#f4f2ec',
    icons: [
      { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png', purpose: 'any' },
      { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png', purpose: 'any' },
      { src: '/icons/icon-maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
      { src: '/icons/icon.svg', sizes: 'any', type: 'image/svg+xml', purpose: 'any' },
    ],
  },
  injectManifest: {
    globPatterns: ['**/*.{js,css,html,woff2,svg,png}'],
    // English text needs the Latin subsets of the font; the others load only if such text is ever shown.
    globIgnores: ['**/noto-sans-{cyrillic,cyrillic-ext,greek,greek-ext,devanagari,vietnamese}-*'],
    maximumFileSizeToCacheInBytes: 3 * 1024 * 1024,
  },
  devOptions: { enabled: false },
});

// The sign-in page rendered at build time into `sign-in.html` (index.html with the page's markup in #root), which
// the API serves at /sign-in: the page paints from HTML and CSS before the scripts arrive, and the client hydrates
// it (apps/web/src/app/prerender.tsx, main.tsx). Lighthouse's mobile profile had it at 91 from a blank page.
function prerenderSignIn(): Plugin {
  let outDir = '';
  return {
    name: 'heatfleet-prerender-sign-in',
    apply: 'build',
    configResolved(config) {
      outDir = path.resolve(config.root, config.build.outDir);
    },
    closeBundle() {
      const script = fileURLToPath(new URL('./packages/devstack/src/prerender-sign-in.ts', import.meta.url));
      execFileSync(process.execPath, ['--import', import.meta.resolve('tsx'), script, outDir], { stdio: 'inherit' });
    },
  };
}

export default defineConfig({
  root: repoRoot,
  publicDir: 'apps/web/public',
  plugins: [react(), tailwindcss(), ...(process.env.VITEST ? [] : [pwa, prerenderSignIn()])],
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
    watch: { ignored: ['**/.data/**', '**/dist/**', '**/dist-slot-*/**', '**/test-results/**'] },
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
