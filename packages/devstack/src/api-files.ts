import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { repoRoot } from './repo-root.ts';

export const apiFiles = {
  dbCli: join(repoRoot, 'apps/api/src/db/db-cli.ts'),
  server: join(repoRoot, 'apps/api/src/server.ts'),
  worker: join(repoRoot, 'apps/api/src/worker.ts'),
};

export const toolFiles = {
  vite: join(repoRoot, 'node_modules/vite/bin/vite.js'),
  vitest: join(repoRoot, 'node_modules/vitest/vitest.mjs'),
  playwright: join(repoRoot, 'node_modules/@playwright/test/cli.js'),
  playwrightConfig: join(repoRoot, 'playwright.config.ts'),
};

export function assertFilesExist(files: string[]): void {
  const missing = files.filter((file) => !existsSync(file));
  if (missing.length > 0) {
    throw new Error(`Not there yet: ${missing.map((file) => file.slice(repoRoot.length + 1)).join(', ')}`);
  }
}
