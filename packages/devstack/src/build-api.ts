import { join } from 'node:path';
import { build } from 'esbuild';
import { repoRoot } from './repo-root.ts';

/**
 * The API and the worker bundled for production: our TypeScript (the apps and the workspace packages) compiled once
 * into one file each, every npm package left as an import of node_modules. Run with plain `node`, without tsx's
 * loader: the server answered sooner and held about 65 MiB less resident memory under the bench's load (README,
 * "Round two"). `npm start`, `npm test` and the cluster still run the sources under tsx.
 */
export const apiBundle = {
  dir: join(repoRoot, 'apps/api/dist'),
  server: join(repoRoot, 'apps/api/dist/server.mjs'),
  worker: join(repoRoot, 'apps/api/dist/worker.mjs'),
};

export async function buildApiBundle(outDir = apiBundle.dir): Promise<void> {
  await build({
    entryPoints: { server: join(repoRoot, 'apps/api/src/server.ts'), worker: join(repoRoot, 'apps/api/src/worker.ts') },
    outdir: outDir,
    outExtension: { '.js': '.mjs' },
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    sourcemap: true,
    logLevel: 'warning',
    plugins: [
      {
        name: 'npm-packages-stay-in-node-modules',
        setup(b) {
          b.onResolve({ filter: /^[^./]/ }, (args) =>
            args.path.startsWith('@heatfleet/') ? undefined : { path: args.path, external: true },
          );
        },
      },
    ],
    // Packages written as CommonJS call require(); an ES module has none of its own.
    banner: {
      js: "import { createRequire as heatfleetRequire } from 'node:module'; const require = heatfleetRequire(import.meta.url);",
    },
  });
}

// `npm run build:api`
if (import.meta.filename === process.argv[1]) {
  await buildApiBundle();
  process.stdout.write(`API bundled into ${apiBundle.dir.slice(repoRoot.length + 1)}/ (server.mjs, worker.mjs)\n`);
}
