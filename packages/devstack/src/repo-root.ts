import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

function isWorkspaceRoot(dir: string): boolean {
  const manifest = join(dir, 'package.json');
  if (!existsSync(manifest)) return false;
  const parsed: unknown = JSON.parse(readFileSync(manifest, 'utf8'));
  return typeof parsed === 'object' && parsed !== null && 'workspaces' in parsed;
}

/** The checkout's root, found by walking up to the package.json that declares the workspaces. */
export function findRepoRoot(start: string = dirname(fileURLToPath(import.meta.url))): string {
  let dir = start;
  for (;;) {
    if (isWorkspaceRoot(dir)) return dir;
    const parent = dirname(dir);
    if (parent === dir) throw new Error(`No workspace root above ${start}`);
    dir = parent;
  }
}

export const repoRoot = findRepoRoot();
