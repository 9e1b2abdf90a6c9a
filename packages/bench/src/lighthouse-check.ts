import { join } from 'node:path';
import { createKnex } from '@heatfleet/api/db/knex.ts';
import { migrateLatest } from '@heatfleet/api/db/migrations.ts';
import { apiFiles } from '@heatfleet/devstack/src/api-files.ts';
import { Lifecycle } from '@heatfleet/devstack/src/lifecycle.ts';
import { httpAnswers200, startService, waitUntil } from '@heatfleet/devstack/src/processes.ts';
import {
  benchApiEnv,
  benchDatabase,
  benchStack,
  startBenchMariadb,
  startBenchRedis,
  stopBenchMariadb,
  stopBenchRedis,
} from './bench-stack.ts';
import { initialBuildSizes, lighthouseScore } from './client-build.ts';
import { signIn } from './load.ts';

// `node --import tsx packages/bench/src/lighthouse-check.ts --dist <built client> [--server <server.ts>]`: only the
// Lighthouse part of the bench, on the bench database, for working on the client between full runs.
const args = process.argv.slice(2);
const option = (name: string) => {
  const at = args.indexOf(`--${name}`);
  return at >= 0 ? args[at + 1] : undefined;
};
const dist = option('dist') ?? benchStack.distDir;
const serverFile = option('server') ?? apiFiles.server;
const api = `http://127.0.0.1:${benchStack.apiPort}`;
const life = new Lifecycle();
life.handleSignals(130);

async function main(): Promise<void> {
  const mariadb = await startBenchMariadb();
  await life.add('the bench MariaDB', () => stopBenchMariadb(mariadb));
  const redis = await startBenchRedis();
  await life.add('the bench Redis', () => stopBenchRedis(redis));
  // The kept data gets the migrations added since it was generated, as `npm run bench` does.
  const db = createKnex(benchDatabase);
  await migrateLatest(db).finally(() => db.destroy());
  const service = startService({
    name: 'api-lighthouse',
    command: process.execPath,
    args: ['--import', 'tsx', serverFile],
    env: { ...process.env, ...benchApiEnv(), WEB_DIST_DIR: dist },
    logFile: join(benchStack.logDir, 'api-lighthouse.log'),
    quiet: true,
  });
  life.watch(service);
  await waitUntil(`${api}/api/health`, () => httpAnswers200(`${api}/api/health`), {
    timeoutMs: 90_000,
    intervalMs: 200,
  });
  const sizes = initialBuildSizes(dist);
  process.stdout.write(`initial JS ${sizes.initialJsGzipKiB} KiB gzipped, CSS ${sizes.initialCssGzipKiB} KiB\n`);
  const owner = await signIn(api, 'owner@quillmere.example', 'heatfleet-bench-2026');
  for (const [url, cookie] of [
    [`${api}/sign-in`, undefined],
    [`${api}/`, owner.cookie],
  ] as const) {
    const l = await lighthouseScore(url, cookie);
    process.stdout.write(
      `${url}: performance ${l.performance ?? 'n/a'}  FCP ${l.firstContentfulPaintMs} ms  LCP ${l.largestContentfulPaintMs} ms  TBT ${l.totalBlockingTimeMs} ms  CLS ${l.cumulativeLayoutShift}${l.error ? `  (${l.error})` : ''}\n`,
    );
  }
}

main().then(
  () => life.shutdown(0),
  (error: unknown) =>
    life.shutdown(1, `lighthouse-check stopped: ${error instanceof Error ? error.message : String(error)}`),
);
