import { spawn } from 'node:child_process';
import { closeSync, existsSync, openSync, readFileSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { buildApiBundle } from './build-api.ts';
import { repoRoot } from './repo-root.ts';

// The production bundle (docker-notes, `npm run build:api`) must start under plain node, without tsx: a package
// left out of node_modules, a require() in an ES module or a path worked out from the source tree fails here.
const outDir = join(repoRoot, 'apps/api', `dist-test-${process.pid}`);
// Nothing listens on port 1: the bundles must not reach the test run's database or queue (a worker would take its
// jobs).
const unreachable = {
  DATABASE_HOST: '127.0.0.1',
  DATABASE_PORT: '1',
  REDIS_URL: 'redis://127.0.0.1:1',
  REDIS_SENTINELS: '',
  SESSION_SECRET: 'a-session-secret-for-the-bundle-test-only-0123456789',
  // The test run's own setting may be quieter; the worker's start is read from its log.
  LOG_LEVEL: 'info',
};
afterAll(() => rmSync(outDir, { recursive: true, force: true }));

async function freePort(): Promise<number> {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as { port: number };
  await new Promise((resolve) => server.close(resolve));
  return port;
}

describe('the API bundle', () => {
  it('starts under plain node and answers its public routes', async () => {
    await buildApiBundle(outDir);
    expect(existsSync(join(outDir, 'server.mjs'))).toBe(true);
    expect(existsSync(join(outDir, 'worker.mjs'))).toBe(true);
    const port = await freePort();
    const api = spawn(process.execPath, [join(outDir, 'server.mjs')], {
      env: {
        ...process.env,
        NODE_ENV: 'production',
        PORT: String(port),
        APP_ORIGIN: `http://127.0.0.1:${port}`,
        ...unreachable,
      },
      stdio: ['ignore', 'ignore', 'pipe'],
    });
    let stderr = '';
    api.stderr.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
    try {
      let openapi: Response | null = null;
      for (let i = 0; i < 100 && !openapi; i += 1) {
        openapi = await fetch(`http://127.0.0.1:${port}/api/openapi.json`).catch(() => null);
        if (!openapi) await new Promise((resolve) => setTimeout(resolve, 100));
      }
      expect(openapi?.status, stderr).toBe(200);
      const spec = (await openapi!.json()) as { paths: Record<string, unknown> };
      expect(Object.keys(spec.paths)).toContain('/api/stock/restock-run');
      // With no database behind it, health answers in the API's own words.
      const health = await fetch(`http://127.0.0.1:${port}/api/health`);
      expect(health.status).toBe(503);
      expect(health.headers.get('content-type')).toMatch(/json/);
    } finally {
      api.kill('SIGTERM');
    }
  }, 60_000);

  it('starts the worker under plain node', async () => {
    if (!existsSync(join(outDir, 'worker.mjs'))) await buildApiBundle(outDir);
    // Its log goes to a file: read through a pipe inside the test run, the first line did not arrive.
    const logFile = join(outDir, 'worker.log');
    const log = openSync(logFile, 'w');
    const worker = spawn(process.execPath, [join(outDir, 'worker.mjs')], {
      env: { ...process.env, NODE_ENV: 'production', ...unreachable },
      stdio: ['ignore', log, log],
    });
    const output = () => readFileSync(logFile, 'utf8');
    try {
      for (let i = 0; i < 200 && !output().includes('Heatfleet worker started'); i += 1)
        await new Promise((resolve) => setTimeout(resolve, 100));
      expect(output()).toContain('Heatfleet worker started');
      expect(worker.exitCode).toBeNull();
    } finally {
      worker.kill('SIGTERM');
      closeSync(log);
    }
  }, 60_000);
});
