import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { cpus, release, totalmem } from 'node:os';
import { join, relative } from 'node:path';
import { setTimeout as sleep } from 'node:timers/promises';
import { cluster, baseUrl } from '@heatfleet/cluster/src/cluster-profile.ts';
import { ClusterStack } from '@heatfleet/cluster/src/cluster-stack.ts';
import { demoPassword } from '@heatfleet/devstack/src/demo-accounts.ts';
import type { Lifecycle } from '@heatfleet/devstack/src/lifecycle.ts';
import { capture } from '@heatfleet/devstack/src/processes.ts';
import { repoRoot } from '@heatfleet/devstack/src/repo-root.ts';
import { ApiClient } from './api-client.ts';
import { checkAcks, checkBalances, connectDatabase, emailStates } from './checks.ts';
import { apiReplicaDrill, galeraWriterDrill } from './cluster-drills.ts';
import { galeraPauseDrill } from './cluster-partition.ts';
import { limiterDrill, redisMasterDrill } from './cluster-redis.ts';
import { check, renderTable, type DrillResult } from './drill-report.ts';
import { answered, SteadyLoad } from './steady-load.ts';

/** Requests per second one replica (one Node process, so at most one core) and the balancer serve, by autocannon. */
async function capacity(cookie: string): Promise<Record<string, unknown>> {
  const run = async (url: string) => {
    const result = await capture(
      process.execPath,
      [
        join(repoRoot, 'node_modules/autocannon/autocannon.js'),
        '-j',
        '-d',
        '10',
        '-c',
        '8',
        '-H',
        `cookie=${cookie}`,
        url,
      ],
      { timeoutMs: 60_000 },
    );
    const out = JSON.parse(result.stdout) as {
      requests: { average: number };
      latency: { p50: number; p99: number };
      non2xx: number;
    };
    return {
      requestsPerSecond: out.requests.average,
      p50Ms: out.latency.p50,
      p99Ms: out.latency.p99,
      non2xx: out.non2xx,
    };
  };
  const path = '/api/stock';
  return {
    path,
    oneReplica: await run(`http://127.0.0.1:${cluster.apiPorts[0]}${path}`),
    balancerThreeReplicas: await run(`${baseUrl}${path}`),
    note: 'GET /api/stock as the demo Owner, 8 connections for 10 s; the machine has 2 cores shared with the databases and other work',
  };
}

export async function runClusterDrill(life: Lifecycle, say: (line: string) => void, began: number): Promise<void> {
  rmSync(cluster.outboxDir, { recursive: true, force: true });
  mkdirSync(cluster.outboxDir, { recursive: true });
  const stack = new ClusterStack(life, say, { dbName: `${cluster.dbName}_drill`, recreateDatabase: true });
  await stack.start();
  const db = connectDatabase(stack.env);
  await life.add('the drill’s database connection', () => db.destroy());
  const firm = (await db('firms').where({ name: 'Brackenford Heating Co.' }).first('id')) as { id: number };
  const depot = (await db('locations').where({ firm_id: firm.id, kind: 'depot' }).orderBy('id').first('id')) as {
    id: number;
  };
  const van = (await db('locations as l')
    .join('memberships as m', 'm.id', 'l.engineer_member_id')
    .join('users as u', 'u.id', 'm.user_id')
    .where({ 'l.firm_id': firm.id, 'u.email': 'engineer@brackenford.example' })
    .first('l.id')) as { id: number };
  const products = (
    (await db('products').where({ firm_id: firm.id }).orderBy('id').limit(3).select('id')) as { id: number }[]
  ).map((p) => p.id);
  const people = {
    owner: new ApiClient(baseUrl, 'owner'),
    stores: new ApiClient(baseUrl, 'stores'),
    engineer: new ApiClient(baseUrl, 'engineer'),
  };
  await people.owner.signIn('owner@brackenford.example', demoPassword);
  await people.stores.signIn('stores@brackenford.example', demoPassword);
  await people.engineer.signIn('engineer@brackenford.example', demoPassword);
  const load = new SteadyLoad(
    { depotId: depot.id, vanId: van.id, productIds: products },
    join(cluster.dataDir, 'acknowledged-writes.jsonl'),
  );
  load.start(people);
  say('Steady load through the balancer: stores, engineer and owner, writes with an Idempotency-Key');
  await sleep(15_000);

  const ctx = { stack, load, db, firmId: firm.id, depotId: depot.id, owner: people.owner, say };
  const results: DrillResult[] = [];
  results.push(await galeraWriterDrill(ctx));
  results.push(await apiReplicaDrill(ctx));
  results.push(await redisMasterDrill(ctx));
  results.push(await galeraPauseDrill(ctx));
  results.push(await limiterDrill(ctx));
  await load.stop();

  const acks = await checkAcks(db, firm.id, load.acks, load.keysTried);
  const balances = await checkBalances(db);
  const emails = await emailStates(db, cluster.outboxDir);
  const ok = load.samples.filter((s) => answered(s.status)).length;
  say('Capacity: autocannon against one replica, then the balancer…');
  const figures = await capacity(people.owner.sessionCookie);
  results.push({
    drill: 'Whole run',
    outage: 'all of the above',
    startedAt: new Date(began).toISOString(),
    seconds: Math.round((Date.now() - began) / 1000),
    checks: [
      check('steady load answered', 'most of it', `${ok} of ${load.samples.length}`, load.samples.length > 0),
      check(
        'acknowledged writes are in the database',
        'all, none twice',
        `${acks.acknowledged - acks.missing.length} of ${acks.acknowledged}; ${acks.duplicated.length} applied twice`,
        acks.acknowledged > 0 && acks.missing.length === 0 && acks.duplicated.length === 0,
      ),
      check(
        'every balance equals its ledger',
        '0 mismatches',
        `${balances.mismatched.length} of ${balances.balances}`,
        balances.mismatched.length === 0,
      ),
      check(
        'every e-mail sent, once',
        'all sent, none twice',
        `${emails.filter((e) => e.sentAt !== null).length} of ${emails.length} sent; ${emails.filter((e) => e.caught > 1).length} caught twice`,
        emails.every((e) => e.sentAt !== null && e.caught === 1),
      ),
    ],
    figures: { requests: load.samples.length, answered: ok, acknowledgedWrites: acks.acknowledged, capacity: figures },
  });

  const outDir = join(repoRoot, 'bench', 'results');
  mkdirSync(outDir, { recursive: true });
  const outFile = join(outDir, `drill-cluster-${new Date().toISOString().slice(0, 10)}.json`);
  const failed = results.flatMap((r) => r.checks.filter((c) => !c.pass).map((c) => `${r.drill}: ${c.what}`));
  const machine = { cpus: cpus().length, memoryGiB: Number((totalmem() / 1024 ** 3).toFixed(1)), kernel: release() };
  const withPassed = results.map((r) => ({
    ...r,
    passed: r.checks.every((c) => c.pass),
    checks: r.checks.map((c) => ({ ...c, passed: c.pass })),
  }));
  writeFileSync(
    outFile,
    `${JSON.stringify({ mode: 'cluster', date: new Date().toISOString(), machine, passed: failed.length === 0, failed, results: withPassed }, null, 2)}\n`,
  );
  process.stdout.write(`\n${renderTable(results)}\n`);
  say(
    `${failed.length === 0 ? 'Every check passed' : `${failed.length} check(s) failed`}. JSON: ${relative(repoRoot, outFile)}`,
  );
  await life.shutdown(failed.length === 0 ? 0 : 1);
}
