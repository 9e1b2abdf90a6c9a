// `node --import tsx packages/devstack/src/prerender-sign-in.ts <built client dir>`, run by vite.config.ts after a
// build: renders the sign-in page (apps/web/src/app/prerender.tsx) with Vite's SSR loader and writes
// `sign-in.html`, the built index.html with that markup in #root. A process of its own because React's server
// renderer leaves a MessagePort open that would keep the build from ever exiting.
import { createHash } from 'node:crypto';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import react from '@vitejs/plugin-react';
import { createServer, type Plugin } from 'vite';
import { repoRoot } from './repo-root.ts';

const outDir = process.argv[2];
if (!outDir) throw new Error('Usage: prerender-sign-in.ts <built client dir>');

// The service worker's registration is never called while rendering; only its import has to resolve.
const pwaRegisterStub: Plugin = {
  name: 'pwa-register-stub',
  resolveId: (id) => (id === 'virtual:pwa-register' ? '\0pwa-register' : null),
  load: (id) => (id === '\0pwa-register' ? 'export const registerSW = () => async () => {};' : null),
};

const server = await createServer({
  configFile: false,
  root: repoRoot,
  logLevel: 'error',
  appType: 'custom',
  server: { middlewareMode: true, hmr: false, watch: null },
  plugins: [react(), pwaRegisterStub],
  resolve: { alias: { '@': join(repoRoot, 'apps/web/src') } },
});
const { renderSignInPage } = (await server.ssrLoadModule('/apps/web/src/app/prerender.tsx')) as {
  renderSignInPage: () => string;
};
const index = readFileSync(join(outDir, 'index.html'), 'utf8');
const root = '<div id="root"></div>';
if (!index.includes(root)) throw new Error('index.html has no empty #root to fill.');
const entryTag = /<script type="module" crossorigin src="(\/assets\/index-[^"]+\.js)"><\/script>/.exec(index);
if (!entryTag) throw new Error("index.html has no entry script tag in Vite's form.");

// The page is plain HTML until someone uses it: the app's script (140 KiB, most of a second of a slow phone's CPU
// to start) is fetched and run at the first touch, key or focus on the page, or at once when /api/me says the
// person is already signed in (the app then takes them on). The button, disabled in the HTML for a browser without
// scripts, is enabled here; a submit before the app has taken the page over is held and sent once it has (the
// form announces it with the 'heatfleet:sign-in-ready' event, apps/web/src/features/auth/components/sign-in-form.tsx).
const boot = `// Starts the app when the pre-rendered sign-in page is first used (packages/devstack/src/prerender-sign-in.ts).
let started = false;
let ready = false;
let held = false;
const start = () => {
  if (started) return;
  started = true;
  import('${entryTag[1]}');
};
for (const type of ['pointerdown', 'touchstart', 'keydown', 'focusin', 'input']) {
  document.addEventListener(type, start, { capture: true, passive: true, once: true });
}
const form = () => document.querySelector('#root form');
const button = form()?.querySelector('button[type="submit"]');
if (button) button.disabled = false;
document.addEventListener(
  'submit',
  (event) => {
    if (ready) return;
    event.preventDefault();
    event.stopImmediatePropagation();
    held = true;
    start();
  },
  true,
);
window.addEventListener(
  'heatfleet:sign-in-ready',
  () => {
    ready = true;
    if (held) form()?.requestSubmit();
  },
  { once: true },
);
// The service worker as the app registers it (apps/web/src/lib/offline/app-update.ts), so the app can be installed
// from this page and opens without signal later; the app's own registration finds this one.
window.addEventListener('load', () => navigator.serviceWorker?.register('/service-worker.js', { scope: '/' }).catch(() => undefined));
fetch('/api/me', { credentials: 'same-origin', headers: { accept: 'application/json' } }).then(
  (answer) => answer.ok && start(),
  () => undefined,
);
`;
const bootFile = `assets/sign-in-boot-${createHash('sha256').update(boot).digest('hex').slice(0, 8)}.js`;
writeFileSync(join(outDir, bootFile), boot);
const page = index
  .replace(root, `<div id="root">${renderSignInPage()}</div>`)
  .replace(entryTag[0], `<script type="module" crossorigin src="/${bootFile}"></script>`)
  .replace(/\s*<link rel="modulepreload"[^>]*>/g, '');
writeFileSync(join(outDir, 'sign-in.html'), page);
await server.close();
process.exit(0);
