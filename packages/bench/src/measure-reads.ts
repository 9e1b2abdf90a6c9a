import { mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { loadavg } from 'node:os';
import { join, relative } from 'node:path';
import { apiFiles } from '@heatfleet/devstack/src/api-files.ts';
import { Lifecycle } from '@heatfleet/devstack/src/lifecycle.ts';
import { httpAnswers200, startService, waitUntil } from '@heatfleet/devstack/src/processes.ts';
import { repoRoot } from '@heatfleet/devstack/src/repo-root.ts';
import { createKnex } from '@heatfleet/api/db/knex.ts';
import { migrateLatest } from '@heatfleet/api/db/migrations.ts';
import {
  benchApiEnv,
  benchDatabase,
  benchStack,
  startBenchMariadb,
  startBenchRedis,
  stopBenchMariadb,
  stopBenchRedis,
} from './bench-stack.ts';
import { cpuShares, ownFunctionsInclusive, topFunctions } from './cpu-profile.ts';
import type { GeneratedDatabase } from './generate-large-firm.ts';
import { load, round, serialLatency, signIn } from './load.ts';
import { sampleRss } from './rss-sampler.ts';

// `node --import tsx packages/bench/src/measure-reads.ts [--firms large,small] [--count 10] [--profile] [--label x]`:
// each heavy read of the bench's firms sent alone, one at a time (median and max ms of --count requests, with the
// answer's size), on the bench database, without the load runs of `npm run bench`; a before/after for one change
// takes a minute instead of half an hour. --profile runs the API under --cpu-prof and lists where its time went.
const args = process.argv.slice(2);
const option = (name: string) => {
  const at = args.indexOf(`--${name}`);
  return at >= 0 ? args[at + 1] : undefined;
};
const firmKeys = (option('firms') ?? 'large').split(',');
const count = Number(option('count') ?? '10');
const profile = args.includes('--profile');
const label = option('label') ?? 'current';
const only = option('reads')?.split(',');
// --load N: each read also under 32 connections for N seconds, with the API's peak resident memory during it.
const loadSeconds = Number(option('load') ?? '0');
// --server: another checkout's server.ts (a before/after on the same machine, in the same minutes), or a production
// bundle (`npm run build:api`, a .mjs file), which runs under plain node as in production.
const serverFile = option('server') ?? apiFiles.server;
const api = `http://127.0.0.1:${benchStack.apiPort}`;
const life = new Lifecycle();
life.handleSignals(130);

const say = (line: string) => process.stdout.write(`${line}\n`);

/** Waits until the API answers promptly again (requests queued behind a slow read run on after the load stops). */
async function drained(): Promise<void> {
  const deadline = Date.now() + 120_000;
  while (Date.now() < deadline) {
    const began = Date.now();
    if ((await httpAnswers200(`${api}/api/health`)) && Date.now() - began < 200) return;
    await new Promise((resolve) => setTimeout(resolve, 1_000));
  }
}

async function main(): Promise<void> {
  mkdirSync(benchStack.logDir, { recursive: true });
  const mariadb = await startBenchMariadb();
  await life.add('the bench MariaDB', () => stopBenchMariadb(mariadb));
  const redis = await startBenchRedis();
  await life.add('the bench Redis', () => stopBenchRedis(redis));
  const generated = JSON.parse(readFileSync(benchStack.generatedMarker, 'utf8')) as GeneratedDatabase;
  const db = createKnex(benchDatabase);
  await migrateLatest(db).finally(() => db.destroy());

  const profileDir = join(benchStack.dataDir, 'profiles', `reads-${label}`);
  rmSync(profileDir, { recursive: true, force: true });
  mkdirSync(profileDir, { recursive: true });
  const service = startService({
    name: 'api-reads',
    command: process.execPath,
    args: [
      ...(profile ? ['--cpu-prof', '--cpu-prof-dir', profileDir] : []),
      ...(serverFile.endsWith('.mjs') ? [] : ['--import', 'tsx']),
      serverFile,
    ],
    env: { ...process.env, ...benchApiEnv() },
    logFile: join(benchStack.logDir, 'api-reads.log'),
    quiet: true,
  });
  life.watch(service);
  await waitUntil(`${api}/api/health`, () => httpAnswers200(`${api}/api/health`), {
    timeoutMs: 90_000,
    intervalMs: 200,
    failEarly: () => (service.hasExited() ? `the API exited (see ${service.logFile})` : null),
  });

  say(`${label}: one request at a time, median of ${count} (load average ${loadavg().map((n) => round(n, 2))})`);
  const figures = [];
  for (const key of firmKeys) {
    const firm = generated.firms.find((f) => f.key === key);
    if (!firm) throw new Error(`No bench firm '${key}'.`);
    const owner = await signIn(api, firm.ownerEmail, generated.password);
    const engineer = await signIn(api, firm.engineerEmail, generated.password);
    const reads: [string, string, typeof owner][] = [
      ['van stock', '/api/me/van/stock', engineer],
      ['stock grid', '/api/stock', owner],
      ['grid 100 places', '/api/stock?limit=100', owner],
      ['restock run', '/api/stock/restock-run', owner],
      ['overview', '/api/overview', owner],
      ['booked short', '/api/stock/booked-jobs-short', owner],
      ['kits list', '/api/kits', owner],
      ['kit items page', '/api/kit-items', owner],
      // The cheapest signed-in list read: what every request pays before its own work (issue 16).
      ['ledger first', '/api/stock/movements', owner],
      // The largest answer: the ledger's CSV, up to 100,000 movements.
      ['ledger csv', '/api/stock/movements.csv', owner],
    ];
    for (const [name, path, session] of reads) {
      if (only && !only.includes(name)) continue;
      const headers = { cookie: session.cookie };
      const first = await fetch(`${api}${path}`, { headers });
      const bytes = (await first.arrayBuffer()).byteLength;
      const alone = await serialLatency(`${api}${path}`, headers, count);
      figures.push({ firm: key, name, path, bytes, ...alone, status: first.status, underLoad: null as unknown });
      say(
        `  ${key.padEnd(7)} ${name.padEnd(16)} ${String(alone.medianMs).padStart(8)} ms median  ${String(alone.maxMs).padStart(8)} ms max  ${(bytes / 1024).toFixed(1).padStart(8)} KiB  ${first.status}`,
      );
    }
    // Under load after every read alone, so requests still queued behind a slow one never meet a measurement.
    if (loadSeconds > 0)
      for (const [name, path, session] of reads) {
        const figure = figures.find((f) => f.firm === key && f.name === name);
        if (!figure || figure.status !== 200) continue;
        const headers = { cookie: session.cookie };
        const rss = sampleRss(service.pid, 200);
        const result = await load({ url: `${api}${path}`, connections: 32, seconds: loadSeconds, headers });
        await drained();
        const peakRssMiB = rss.stop().maxMiB;
        figure.underLoad = { ...result, peakRssMiB };
        say(
          `  ${key.padEnd(7)} ${name.padEnd(16)} 32 connections: ${result.requestsPerSecond} req/s, p99 ${result.p99Ms} ms, errors ${result.errors}, peak RSS ${peakRssMiB} MiB`,
        );
      }
  }
  const rssKiB = Number(/VmRSS:\s+(\d+)/.exec(readFileSync(`/proc/${service.pid}/status`, 'utf8'))?.[1] ?? 0);
  say(`  API resident memory at the end: ${round(rssKiB / 1024, 1)} MiB`);
  await service.stop(15_000);

  let functions: ReturnType<typeof topFunctions> = [];
  let inclusive: ReturnType<typeof ownFunctionsInclusive> = [];
  if (profile) {
    const file = readdirSync(profileDir).find((f) => f.endsWith('.cpuprofile'));
    if (file) {
      const parsed = JSON.parse(readFileSync(join(profileDir, file), 'utf8'));
      say('  CPU of the API by package (self time):');
      for (const s of cpuShares(parsed).slice(0, 12))
        say(`    ${s.name.padEnd(28)} ${s.percent.toFixed(1).padStart(5)}%`);
      functions = topFunctions(parsed, 25);
      say('  CPU of the API by function (self time):');
      for (const f of functions) say(`    ${f.percent.toFixed(1).padStart(5)}%  ${f.name}`);
      inclusive = ownFunctionsInclusive(parsed, 30);
      say('  CPU of the API by own function, with what it called:');
      for (const f of inclusive) say(`    ${f.percent.toFixed(1).padStart(5)}%  ${f.name}`);
    } else say('  no CPU profile was written');
  }
  mkdirSync(benchStack.resultsDir, { recursive: true });
  const out = join(benchStack.resultsDir, `reads-${label}-${new Date().toISOString().replace(/[:.]/g, '-')}.json`);
  writeFileSync(
    out,
    `${JSON.stringify({ label, date: new Date().toISOString(), loadAverage: loadavg(), count, figures, apiRssMiB: round(rssKiB / 1024, 1), functions, inclusive }, null, 2)}\n`,
  );
  say(`Wrote ${relative(repoRoot, out)}`);
}

main().then(
  () => life.shutdown(0),
  (error: unknown) =>
    life.shutdown(1, `measure stopped: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}`),
);
