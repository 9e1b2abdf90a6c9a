import { mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { createPool, type Pool } from 'mysql2/promise';
import { createKnex } from '@heatfleet/api/db/knex.ts';
import { migrateLatest } from '@heatfleet/api/db/migrations.ts';
import { apiFiles } from '@heatfleet/devstack/src/api-files.ts';
import { Lifecycle } from '@heatfleet/devstack/src/lifecycle.ts';
import { httpAnswers200, startService, waitUntil, type Service } from '@heatfleet/devstack/src/processes.ts';
import { repoRoot } from '@heatfleet/devstack/src/repo-root.ts';
import {
  benchApiEnv,
  benchDatabase,
  benchStack,
  startBenchMariadb,
  startBenchRedis,
  stopBenchMariadb,
  stopBenchRedis,
} from './bench-stack.ts';
import { connection } from './generate-large-firm.ts';
import { load, round, serialLatency, signIn } from './load.ts';
import { cpuShares, type CpuShare } from './cpu-profile.ts';

// `npm run bench:profile [-- --server <server.ts> --label <name>]`: the fixed cost of one signed-in request on the
// bench database. A cheap member read (GET /api/firm, one row) is sent alone (statements per request, counted by
// MariaDB's own counters) and under load with the API under --cpu-prof (each package's share of the CPU), beside the
// bare Express + mysql2 baseline in the same run. --server points at another checkout's server.ts (a before/after).
const args = process.argv.slice(2);
const option = (name: string) => {
  const at = args.indexOf(`--${name}`);
  return at >= 0 ? args[at + 1] : undefined;
};
const serverFile = option('server') ?? apiFiles.server;
const label = option('label') ?? 'current';
const seconds = Number(process.env.BENCH_SECONDS ?? '10');
const path = option('path') ?? '/api/firm';
const api = `http://127.0.0.1:${benchStack.apiPort}`;
const life = new Lifecycle();
life.handleSignals(130);

function say(line: string): void {
  process.stdout.write(`${line}\n`);
}

function launch(name: string, argv: string[], env: NodeJS.ProcessEnv): Service {
  const service = startService({
    name,
    command: process.execPath,
    args: argv,
    env,
    logFile: join(benchStack.logDir, `${name}.log`),
    quiet: true,
  });
  life.watch(service);
  return service;
}

async function counters(pool: Pool): Promise<Record<string, number>> {
  const [rows] = (await pool.query(
    "SHOW GLOBAL STATUS WHERE Variable_name IN ('Com_select', 'Com_update', 'Com_insert', 'Com_delete', 'Questions')",
  )) as unknown as [{ Variable_name: string; Value: string }[]];
  return Object.fromEntries(rows.map((r) => [r.Variable_name, Number(r.Value)]));
}

async function main(): Promise<void> {
  mkdirSync(benchStack.logDir, { recursive: true });
  const mariadb = await startBenchMariadb();
  await life.add('the bench MariaDB', () => stopBenchMariadb(mariadb));
  const redis = await startBenchRedis();
  await life.add('the bench Redis', () => stopBenchRedis(redis));
  // The kept data gets the migrations added since it was generated, as `npm run bench` does.
  const db = createKnex(benchDatabase);
  await migrateLatest(db).finally(() => db.destroy());
  const pool = createPool({ ...connection(), connectionLimit: 1 });
  await life.add('the pool', () => pool.end());

  const profileDir = join(benchStack.dataDir, 'profiles', label);
  rmSync(profileDir, { recursive: true, force: true });
  mkdirSync(profileDir, { recursive: true });
  const apiService = launch(
    'api-profile',
    ['--cpu-prof', '--cpu-prof-dir', profileDir, '--import', 'tsx', serverFile],
    { ...process.env, ...benchApiEnv() },
  );
  const baseline = launch(
    'baseline',
    ['--import', 'tsx', join(import.meta.dirname, 'baseline-server.ts')],
    process.env,
  );
  await waitUntil(`${api}/api/health`, () => httpAnswers200(`${api}/api/health`), {
    timeoutMs: 90_000,
    intervalMs: 200,
  });
  const baseUrl = `http://127.0.0.1:${benchStack.baselinePort}/firm/1`;
  await waitUntil(baseUrl, () => httpAnswers200(baseUrl), { timeoutMs: 30_000, intervalMs: 200 });

  const owner = await signIn(api, 'owner@quillmere.example', 'heatfleet-bench-2026');
  const headers = { cookie: owner.cookie };
  await serialLatency(`${api}${path}`, headers, 20);

  // Statements per request: MariaDB's counters around 200 requests, one at a time (the pool's own query is 1).
  const count = 200;
  const before = await counters(pool);
  const alone = await serialLatency(`${api}${path}`, headers, count);
  const after = await counters(pool);
  const perRequest = Object.fromEntries(
    Object.entries(after).map(([k, v]) => [k, round((v - (before[k] ?? 0) - (k === 'Questions' ? 1 : 0)) / count, 2)]),
  );
  say(`${label}: GET ${path} alone: median ${alone.medianMs} ms; per request ${JSON.stringify(perRequest)}`);

  await load({ url: baseUrl, connections: 8, seconds: 1 });
  const base = await load({ url: baseUrl, connections: 32, seconds });
  await load({ url: `${api}${path}`, connections: 8, seconds: 1, headers });
  const under = await load({ url: `${api}${path}`, connections: 32, seconds, headers });
  say(
    `  baseline ${base.requestsPerSecond} req/s; ${path} ${under.requestsPerSecond} req/s (${round((100 * under.requestsPerSecond) / base.requestsPerSecond, 1)}% of baseline), p50 ${under.p50Ms} ms, p99 ${under.p99Ms} ms`,
  );
  const rssKiB = Number(/VmRSS:\s+(\d+)/.exec(readFileSync(`/proc/${apiService.pid}/status`, 'utf8'))?.[1] ?? 0);

  await apiService.stop(15_000);
  await baseline.stop(5_000);
  const file = readdirSync(profileDir).find((f) => f.endsWith('.cpuprofile'));
  let shares: CpuShare[] = [];
  if (file) {
    shares = cpuShares(JSON.parse(readFileSync(join(profileDir, file), 'utf8')));
    say('  CPU of the API process by package (self time, whole run):');
    for (const s of shares.slice(0, 16)) say(`    ${s.name.padEnd(28)} ${s.percent.toFixed(1).padStart(5)}%`);
  } else say('  no CPU profile was written');
  const out = join(benchStack.resultsDir, `profile-${label}-${new Date().toISOString().replace(/[:.]/g, '-')}.json`);
  mkdirSync(benchStack.resultsDir, { recursive: true });
  writeFileSync(
    out,
    `${JSON.stringify({ label, path, aloneMedianMs: alone.medianMs, statementsPerRequest: perRequest, baseline: base, underLoad: under, apiRssMiB: round(rssKiB / 1024, 1), cpuShares: shares }, null, 2)}\n`,
  );
  say(`Wrote ${relative(repoRoot, out)}`);
}

main().then(
  () => life.shutdown(0),
  (error: unknown) =>
    life.shutdown(1, `profile stopped: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}`),
);
