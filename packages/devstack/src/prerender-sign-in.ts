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

// The app's script starts after the page has painted, not beside the HTML: on a slow link its 140 KiB would
// otherwise share the line with the stylesheet the first paint waits for. It hydrates the page when it runs.
const boot = `// Starts the app once the pre-rendered sign-in page has painted (packages/devstack/src/prerender-sign-in.ts).
let started = false;
const start = () => {
  if (started) return;
  started = true;
  import('${entryTag[1]}');
};
// After the second frame: the first has been painted by then. A tab in the background runs no frames.
requestAnimationFrame(() => requestAnimationFrame(start));
setTimeout(start, 1000);
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
