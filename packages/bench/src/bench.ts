import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { cpus, loadavg, totalmem } from 'node:os';
import { join, relative } from 'node:path';
import { createPool, type Pool } from 'mysql2/promise';
import { addDays, calendarDateIn, DEFAULT_TIME_ZONE } from '@heatfleet/domain';
import { toolFiles } from '@heatfleet/devstack/src/api-files.ts';
import { apiBundle, buildApiBundle } from '@heatfleet/devstack/src/build-api.ts';
import { Lifecycle } from '@heatfleet/devstack/src/lifecycle.ts';
import {
  assertPortsFree,
  httpAnswers200,
  nodeTsArgs,
  runStep,
  startService,
  waitUntil,
  type Service,
} from '@heatfleet/devstack/src/processes.ts';
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
import { benchTargets, FLOOR_READ } from './bench-targets.ts';
import { initialBuildSizes, lighthouseScore, type BuildSizes, type LighthouseScore } from './client-build.ts';
import {
  benchDatabaseIsGenerated,
  connection,
  generateBenchDatabase,
  type GeneratedDatabase,
} from './generate-large-firm.ts';
import { balancesDisagreeingWithLedger } from './large-firm.ts';
import { restockSimulationFigures } from './restock-simulation.ts';
import { getJson, load, postJson, round, serialLatency, signIn, type LoadResult, type Session } from './load.ts';
import { sampleRss } from './rss-sampler.ts';

// BENCH_SECONDS shortens every load run when trying the bench out; the reported figures use the default.
const seconds = Number(process.env.BENCH_SECONDS ?? '10');
const readConnections = 32;
const hotConnections = 50;
const serialCount = 20;
const api = `http://127.0.0.1:${benchStack.apiPort}`;
const baselineUrl = `http://127.0.0.1:${benchStack.baselinePort}`;

const life = new Lifecycle();
life.handleSignals(130);

function say(line: string): void {
  process.stdout.write(`${line}\n`);
}

interface ReadFigure extends LoadResult {
  name: string;
  firm: string;
  movements: number;
  path: string;
  ratioToBaseline: number;
  serialMedianMs: number;
  serialMaxMs: number;
  status: number;
  /** The API's peak resident memory while this read was measured (its serial requests and its load). */
  peakRssMiB?: number;
}

function launch(name: string, file: string, env: NodeJS.ProcessEnv): Service {
  const service = startService({
    name,
    command: process.execPath,
    // A production bundle (.mjs) runs under plain node, as in production; sources under tsx.
    args: file.endsWith('.mjs') ? ['--enable-source-maps', file] : nodeTsArgs(file),
    env,
    logFile: join(benchStack.logDir, `${name}.log`),
    quiet: true,
  });
  life.watch(service);
  return service;
}

async function waitFor(url: string, service: Service): Promise<void> {
  await waitUntil(url, () => httpAnswers200(url), {
    timeoutMs: 90_000,
    intervalMs: 200,
    failEarly: () => (service.hasExited() ? `${service.name} exited (see ${service.logFile})` : null),
  });
}

async function firmIds(pool: Pool, firmId: number) {
  const [depot] = (
    await pool.query("SELECT id FROM locations WHERE firm_id = ? AND kind = 'depot' ORDER BY id LIMIT 1", [firmId])
  )[0] as { id: number }[];
  const vans = (
    (await pool.query("SELECT id FROM locations WHERE firm_id = ? AND kind = 'van' ORDER BY id", [firmId]))[0] as {
      id: number;
    }[]
  ).map((r) => r.id);
  const products = (
    (await pool.query('SELECT id FROM products WHERE firm_id = ? ORDER BY id', [firmId]))[0] as { id: number }[]
  ).map((r) => r.id);
  const [count] = (await pool.query('SELECT COUNT(*) AS n FROM stock_movements WHERE firm_id = ?', [firmId]))[0] as {
    n: number;
  }[];
  // A cursor nine tenths of the way down the ledger (newest first): the page a keyset must reach without scanning.
  const [deep] = (
    await pool.query('SELECT id FROM stock_movements WHERE firm_id = ? ORDER BY id LIMIT 1 OFFSET ?', [
      firmId,
      Math.floor(Number(count!.n) / 10),
    ])
  )[0] as { id: number }[];
  return { depotId: depot!.id, vans, products, movements: Number(count!.n), deepCursor: Number(deep!.id) };
}

/** Waits until the API answers promptly again: requests queued behind a slow read are still running after autocannon stops. */
async function drained(): Promise<void> {
  const deadline = Date.now() + 120_000;
  while (Date.now() < deadline) {
    const began = Date.now();
    const ok = await httpAnswers200(`${api}/api/health`);
    if (ok && Date.now() - began < 500) return;
    await new Promise((resolve) => setTimeout(resolve, 1_000));
  }
}

async function measureRead(
  name: string,
  firm: string,
  movements: number,
  path: string,
  session: Session,
  baselineRps: number,
): Promise<ReadFigure> {
  const headers = { cookie: session.cookie };
  const serial = await serialLatency(`${api}${path}`, headers, serialCount);
  await load({ url: `${api}${path}`, connections: 8, seconds: 1, headers });
  const result = await load({ url: `${api}${path}`, connections: readConnections, seconds, headers });
  await drained();
  const figure = {
    name,
    firm,
    movements,
    path,
    ...result,
    ratioToBaseline: round(result.requestsPerSecond / baselineRps, 3),
    serialMedianMs: serial.medianMs,
    serialMaxMs: serial.maxMs,
    status: serial.status,
  };
  say(
    `  ${name.padEnd(16)} ${firm.padEnd(7)} ${String(result.requestsPerSecond).padStart(8)} req/s  ${(figure.ratioToBaseline * 100).toFixed(1).padStart(5)}% of baseline  p50 ${result.p50Ms} ms  p99 ${result.p99Ms} ms  alone ${serial.medianMs} ms  errors ${result.errors}${serial.status === 200 ? '' : `  (answers ${serial.status})`}`,
  );
  return figure;
}

function machine(version: string) {
  return {
    date: new Date().toISOString(),
    nproc: cpus().length,
    cpu: cpus()[0]?.model ?? 'unknown',
    ramGiB: round(totalmem() / 1024 ** 3, 1),
    node: process.version,
    mariadb: version,
    loadAverageAtStart: loadavg().map((n) => round(n, 2)),
  };
}

function table(rows: string[][]): string {
  const widths = rows[0]!.map((_, c) => Math.max(...rows.map((r) => r[c]!.length)));
  return rows
    .map((r, i) => {
      const line = `| ${r.map((cell, c) => cell.padEnd(widths[c]!)).join(' | ')} |`;
      return i === 0 ? `${line}\n|${widths.map((w) => '-'.repeat(w + 2)).join('|')}|` : line;
    })
    .join('\n');
}

async function main(): Promise<void> {
  mkdirSync(benchStack.logDir, { recursive: true });
  mkdirSync(benchStack.resultsDir, { recursive: true });
  await assertPortsFree([
    { port: benchStack.apiPort, what: 'the API under test' },
    { port: benchStack.baselinePort, what: 'the baseline server' },
  ]);
  const mariadb = await startBenchMariadb();
  await life.add('the bench MariaDB', () => stopBenchMariadb(mariadb));
  const redis = await startBenchRedis();
  await life.add('the bench Redis', () => stopBenchRedis(redis));
  say(
    `MariaDB ${mariadb.port} and Redis ${redis.port} for the bench, data in ${relative(repoRoot, benchStack.dataDir)}`,
  );
  if (!benchDatabaseIsGenerated()) {
    say('No bench database yet: generating it (a few minutes)…');
    await generateBenchDatabase();
  }
  const generated = JSON.parse(readFileSync(benchStack.generatedMarker, 'utf8')) as GeneratedDatabase;
  // Migrations added since the data was generated (new indexes, say) apply to it as to any database.
  const db = createKnex(benchDatabase);
  const applied = await migrateLatest(db).finally(() => db.destroy());
  if (applied.length > 0) say(`Applied ${applied.length} new migration(s): ${applied.join(', ')}`);
  // Restock for booked jobs (restock-simulation.ts): the demo firm's year replayed; target 0 jobs starting short.
  const simDb = createKnex(benchDatabase);
  const restockSimulation = await restockSimulationFigures(simDb).finally(() => simDb.destroy());
  say(
    restockSimulation
      ? `Restock simulation, ${restockSimulation.jobs} demo jobs: ${restockSimulation.shortStartsBookedJobs} started short of chemical with booked-job restock (target 0), ${restockSimulation.shortStartsParOnly} with par levels alone`
      : 'Restock simulation: no demo firm in the bench database',
  );

  say('Building the client for production…');
  const buildCode = await runStep(
    process.execPath,
    [toolFiles.vite, 'build', '--outDir', benchStack.distDir, '--emptyOutDir', '--logLevel', 'warn'],
    { env: { ...process.env, NODE_ENV: 'production' }, cwd: repoRoot },
  );
  if (buildCode !== 0) throw new Error(`vite build failed (exit ${buildCode}).`);
  say('Bundling the API for production (npm run build:api)…');
  await buildApiBundle();
  const sizes: BuildSizes = initialBuildSizes(benchStack.distDir);
  say(
    `  initial JS ${sizes.initialJsGzipKiB} KiB gzipped (${sizes.jsFiles.length} files), CSS ${sizes.initialCssGzipKiB} KiB gzipped`,
  );

  const pool = createPool({ ...connection(), connectionLimit: 2 });
  await life.add('the bench pool', () => pool.end());
  const [[{ version }]] = (await pool.query('SELECT VERSION() AS version')) as unknown as [[{ version: string }]];
  const machineInfo = machine(version);

  const apiService = launch('api', apiBundle.server, { ...process.env, ...benchApiEnv() });
  const baselineService = launch('baseline', join(import.meta.dirname, 'baseline-server.ts'), process.env);
  await waitFor(`${api}/api/health`, apiService);
  await waitFor(`${baselineUrl}/firm/1`, baselineService);
  say(
    `API (NODE_ENV=production, serving the built client) on ${benchStack.apiPort}; baseline on ${benchStack.baselinePort}`,
  );
  // The API's resident memory through every load run (issue 16: reported, within 300 MB).
  const rss = sampleRss(apiService.pid);

  say(`\nBaseline: bare Express 5 + mysql2, one row by primary key, ${readConnections} connections, ${seconds} s`);
  await load({ url: `${baselineUrl}/firm/1`, connections: 8, seconds: 1 });
  const baseline = await load({ url: `${baselineUrl}/firm/1`, connections: readConnections, seconds });
  say(
    `  ${baseline.requestsPerSecond} req/s  p50 ${baseline.p50Ms} ms  p99 ${baseline.p99Ms} ms  errors ${baseline.errors}`,
  );

  const reads: ReadFigure[] = [];
  const measureProbe = async (name: string, firm: string, movements: number, path: string, session: Session) => {
    const missing = (status: number, note: string) => {
      say(`  ${name.padEnd(16)} ${firm.padEnd(7)} not measured: ${note}`);
      reads.push({
        name,
        firm,
        movements,
        path,
        connections: 0,
        seconds: 0,
        requestsPerSecond: 0,
        p50Ms: 0,
        p99Ms: 0,
        requests: 0,
        errors: 0,
        statusCounts: { [status]: 1 },
        ratioToBaseline: 0,
        serialMedianMs: 0,
        serialMaxMs: 0,
        status,
      });
    };
    try {
      const probe = await getJson(api, session, path);
      if (probe.status !== 200) return missing(probe.status, `GET ${path} answers ${probe.status}`);
      rss.windowPeakMiB();
      const figure = await measureRead(name, firm, movements, path, session, baseline.requestsPerSecond);
      figure.peakRssMiB = rss.windowPeakMiB();
      say(`  ${''.padEnd(16)} ${''.padEnd(7)} the API's resident memory at most ${figure.peakRssMiB} MiB`);
      reads.push(figure);
    } catch (error) {
      missing(0, `GET ${path} failed: ${error instanceof Error ? error.message : String(error)}`);
    }
  };
  const sessions = new Map<string, { owner: Session; engineer: Session }>();
  for (const firm of generated.firms) {
    const owner = await signIn(api, firm.ownerEmail, generated.password);
    const engineer = await signIn(api, firm.engineerEmail, generated.password);
    sessions.set(firm.key, { owner, engineer });
    const ids = await firmIds(pool, firm.firmId);
    say(
      `\nSigned-in reads, ${firm.name} (${ids.movements.toLocaleString('en-GB')} movements), ${readConnections} connections, ${seconds} s each`,
    );
    const probes: [string, string, Session][] = [
      [FLOOR_READ, '/api/firm', owner],
      ['van stock', '/api/me/van/stock', engineer],
      ['kits list', '/api/kits', owner],
      ['kit items page', '/api/kit-items', owner],
      ['ledger first', '/api/stock/movements', owner],
      ['ledger deep', `/api/stock/movements?before=${ids.deepCursor}`, owner],
      ['stock grid', '/api/stock', owner],
      ['restock run', '/api/stock/restock-run', owner],
    ];
    for (const [name, path, session] of probes) await measureProbe(name, firm.key, ids.movements, path, session);
  }

  // Writes on the large firm: "use one pack", spread over 64 vans, then all on one van's one product.
  const large = generated.firms.find((f) => f.key === 'large')!;
  const owner = sessions.get('large')!.owner;
  const ids = await firmIds(pool, large.firmId);
  const [spreadProduct, hotProduct] = [ids.products[0]!, ids.products[1]!];
  const spreadVans = ids.vans.slice(0, 64);
  const hotVan = ids.vans[ids.vans.length - 1]!;
  const expiresOn = addDays(calendarDateIn(new Date(), DEFAULT_TIME_ZONE), 700);
  const stamp = Date.now().toString(36);
  say('\nRefilling stock for the writes (a delivery to the depot, then transfers to the vans, through the API)…');
  const receipt = await postJson<{ movements: { batch: { id: number }; product: { id: number } }[] }>(
    api,
    owner,
    '/api/stock/receipts',
    {
      locationId: ids.depotId,
      reference: `BENCH-${stamp}`,
      lines: [
        { productId: spreadProduct, lotNumber: `BENCH-${stamp}-S`, expiresOn, quantity: 100_000 },
        { productId: hotProduct, lotNumber: `BENCH-${stamp}-H`, expiresOn, quantity: 100_000 },
      ],
    },
  );
  if (receipt.status !== 201)
    throw new Error(`The refill delivery answered ${receipt.status}: ${JSON.stringify(receipt.body)}`);
  const batchOf = (productId: number) => receipt.body.movements.find((m) => m.product.id === productId)!.batch.id;
  for (const van of spreadVans) {
    const moved = await postJson(api, owner, '/api/stock/transfers', {
      fromLocationId: ids.depotId,
      toLocationId: van,
      lines: [{ productId: spreadProduct, batchId: batchOf(spreadProduct), quantity: 1_500 }],
    });
    if (moved.status !== 201)
      throw new Error(`A refill transfer answered ${moved.status}: ${JSON.stringify(moved.body)}`);
  }
  const hotMoved = await postJson(api, owner, '/api/stock/transfers', {
    fromLocationId: ids.depotId,
    toLocationId: hotVan,
    lines: [{ productId: hotProduct, batchId: batchOf(hotProduct), quantity: 100_000 }],
  });
  if (hotMoved.status !== 201)
    throw new Error(`The hot refill answered ${hotMoved.status}: ${JSON.stringify(hotMoved.body)}`);

  const writeHeaders = { cookie: owner.cookie, 'x-csrf-token': owner.csrfToken };
  const usedRows = async (van: number[], productId: number, sinceId: number) =>
    Number(
      (
        (
          await pool.query(
            `SELECT COUNT(*) AS n FROM stock_movements WHERE firm_id = ? AND kind = 'used' AND product_id = ? AND location_id IN (?) AND id > ?`,
            [large.firmId, productId, van, sinceId],
          )
        )[0] as { n: number }[]
      )[0]!.n,
    );
  const lastId = async () =>
    Number(
      ((await pool.query('SELECT COALESCE(MAX(id), 0) AS id FROM stock_movements'))[0] as { id: number }[])[0]!.id,
    );
  const writes: (LoadResult & { name: string; acknowledged: number; ledgerRows: number })[] = [];
  for (const [name, connections, body, vans, productId] of [
    [
      'use one pack',
      readConnections,
      (n: number) => ({
        locationId: spreadVans[n % spreadVans.length],
        productId: spreadProduct,
        quantity: 1,
        reason: 'Bench: one pack used',
      }),
      spreadVans,
      spreadProduct,
    ],
    [
      'use one pack hot',
      hotConnections,
      () => ({ locationId: hotVan, productId: hotProduct, quantity: 1, reason: 'Bench: one pack used' }),
      [hotVan],
      hotProduct,
    ],
  ] as const) {
    const since = await lastId();
    const result = await load({
      url: `${api}/api/stock/usages`,
      method: 'POST',
      connections,
      seconds,
      headers: writeHeaders,
      bodyFor: body,
    });
    await drained();
    const acknowledged = result.statusCounts['201'] ?? 0;
    const ledgerRows = await usedRows([...vans], productId, since);
    writes.push({ name, ...result, acknowledged, ledgerRows });
    say(
      `  ${name.padEnd(16)} ${String(connections).padStart(2)} conns ${String(result.requestsPerSecond).padStart(8)} req/s  p50 ${result.p50Ms} ms  p99 ${result.p99Ms} ms  errors ${result.errors} ${JSON.stringify(result.statusCounts)}  201s ${acknowledged}, ledger rows ${ledgerRows}`,
    );
  }
  const disagreeing = await balancesDisagreeingWithLedger(pool, large.firmId);
  say(`  after the writes: ${disagreeing} balances of ${large.name} disagree with their ledger`);

  // The owner overview last: another session is building it, and a slow one must not disturb the rest.
  say(`\nOwner overview (GET /api/overview), ${readConnections} connections, ${seconds} s each`);
  for (const firm of generated.firms) {
    const movements = (await firmIds(pool, firm.firmId)).movements;
    await measureProbe('overview', firm.key, movements, '/api/overview', sessions.get(firm.key)!.owner);
  }

  say('\nLighthouse (mobile profile, simulated throttling) on Debian\u2019s Chromium…');
  const lighthouse: LighthouseScore[] = [];
  lighthouse.push(await lighthouseScore(`${api}/sign-in`));
  lighthouse.push(await lighthouseScore(`${api}/`, owner.cookie));
  for (const l of lighthouse)
    say(
      `  ${l.url}: performance ${l.performance ?? 'n/a'}  FCP ${l.firstContentfulPaintMs} ms  LCP ${l.largestContentfulPaintMs} ms  TBT ${l.totalBlockingTimeMs} ms  CLS ${l.cumulativeLayoutShift}${l.error ? `  (${l.error})` : ''}`,
    );

  // Growth: the cost of one request alone at 1M movements against the same read at 10k (and 100k).
  const growthNames = ['van stock', 'ledger first', 'ledger deep', 'stock grid', 'restock run', 'overview'];
  const find = (name: string, firm: string) =>
    reads.find((r) => r.name === name && r.firm === firm && r.status === 200);
  const growth = growthNames.map((name) => {
    const [s, m, l] = [find(name, 'small'), find(name, 'medium'), find(name, 'large')];
    const ratio = (a?: ReadFigure, b?: ReadFigure) =>
      a && b && b.serialMedianMs > 0 ? round(a.serialMedianMs / b.serialMedianMs, 2) : null;
    const loadRatio = (a?: ReadFigure, b?: ReadFigure) =>
      a && b && a.requestsPerSecond > 0 ? round(b.requestsPerSecond / a.requestsPerSecond, 2) : null;
    return {
      name,
      aloneMs: { '10k': s?.serialMedianMs ?? null, '100k': m?.serialMedianMs ?? null, '1M': l?.serialMedianMs ?? null },
      ratio100kTo10k: ratio(m, s),
      ratio1MTo10k: ratio(l, s),
      underLoadCostRatio1MTo10k: loadRatio(l, s),
    };
  });

  const apiRss = rss.stop();
  say(`\nAPI resident memory under the load: ${apiRss.maxMiB} MiB at most, ${apiRss.lastMiB} MiB at the end`);
  const targets = benchTargets({
    reads,
    growth,
    sizes,
    lighthouse,
    readConnections,
    apiRss,
    disagreeing,
    writes,
  });

  say('\nReads (1 request alone: median of 20; under load: 32 connections)');
  say(
    table([
      ['read', 'movements', 'req/s', 'of baseline', 'p50 ms', 'p99 ms', 'errors', 'alone ms'],
      [
        'baseline (PK read)',
        '-',
        String(baseline.requestsPerSecond),
        '100%',
        String(baseline.p50Ms),
        String(baseline.p99Ms),
        String(baseline.errors),
        '-',
      ],
      ...reads.map((r) =>
        r.status === 200
          ? [
              r.name,
              r.movements.toLocaleString('en-GB'),
              String(r.requestsPerSecond),
              `${(r.ratioToBaseline * 100).toFixed(1)}%`,
              String(r.p50Ms),
              String(r.p99Ms),
              String(r.errors),
              String(r.serialMedianMs),
            ]
          : [r.name, r.movements.toLocaleString('en-GB'), 'missing', '-', '-', '-', '-', '-'],
      ),
    ]),
  );
  say('\nWrites');
  say(
    table([
      ['write', 'connections', 'req/s', 'p50 ms', 'p99 ms', 'errors', '201s', 'ledger rows'],
      ...writes.map((w) => [
        w.name,
        String(w.connections),
        String(w.requestsPerSecond),
        String(w.p50Ms),
        String(w.p99Ms),
        String(w.errors),
        String(w.acknowledged),
        String(w.ledgerRows),
      ]),
    ]),
  );
  say('\nGrowth with the ledger (one request alone, median ms)');
  say(
    table([
      ['read', '10k', '100k', '1M', '1M / 10k', 'under load 1M / 10k'],
      ...growth.map((g) => [
        g.name,
        String(g.aloneMs['10k'] ?? '-'),
        String(g.aloneMs['100k'] ?? '-'),
        String(g.aloneMs['1M'] ?? '-'),
        String(g.ratio1MTo10k ?? '-'),
        String(g.underLoadCostRatio1MTo10k ?? '-'),
      ]),
    ]),
  );
  say('\nTargets (reported, not asserted)');
  say(
    table([
      ['target', 'measured', 'met'],
      ...targets.map((t) => [t.target, t.measured, t.met === null ? 'n/a' : t.met ? 'yes' : 'NO']),
    ]),
  );

  const result = {
    machine: machineInfo,
    settings: { seconds, readConnections, hotConnections, serialCount },
    generated,
    baseline,
    reads,
    writes,
    consistency: { disagreeingBalances: disagreeing },
    growth,
    build: sizes,
    lighthouse,
    apiRss,
    targets,
    restockSimulation,
  };
  const file = join(benchStack.resultsDir, `bench-${machineInfo.date.replace(/[:.]/g, '-')}.json`);
  writeFileSync(file, `${JSON.stringify(result, null, 2)}\n`);
  say(`\nWrote ${relative(repoRoot, file)}`);
}

main().then(
  () => life.shutdown(0),
  (error: unknown) =>
    life.shutdown(
      1,
      `npm run bench stopped: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}`,
    ),
);
