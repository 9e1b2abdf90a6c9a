import { mkdirSync, writeFileSync } from 'node:fs';
import { cpus, freemem, release, totalmem } from 'node:os';
import { join, relative } from 'node:path';
import { demoPassword } from '@heatfleet/devstack/src/demo-accounts.ts';
import { Lifecycle } from '@heatfleet/devstack/src/lifecycle.ts';
import { repoRoot } from '@heatfleet/devstack/src/repo-root.ts';
import { ApiClient } from './api-client.ts';
import { checkAcks, checkBalances, connectDatabase, emailStates } from './checks.ts';
import { runClusterDrill } from './cluster-run.ts';
import { check, renderTable, type DrillResult } from './drill-report.ts';
import { DrillStack, profile } from './drill-stack.ts';
import {
  fullDurations,
  mariadbDrill,
  objectStoreDrill,
  quickDurations,
  smtpAndRedisDrills,
  type DrillContext,
} from './drills.ts';
import { answered, SteadyLoad } from './steady-load.ts';

// npm run drill [-- --quick | --cluster]: the full outages of issue 6, short ones for development, or the
// cluster's (packages/cluster: Galera, HAProxy, API replicas, Redis Sentinel).
const argv = process.argv.slice(2);
const unknown = argv.filter((arg) => arg !== '--quick' && arg !== '--cluster');
if (unknown.length > 0 || argv.length > 1) {
  process.stderr.write(`Unknown option ${argv.join(' ')}. Usage: npm run drill [-- --quick | --cluster]\n`);
  process.exit(2);
}
const mode = argv.includes('--quick') ? 'quick' : 'full';
const durations = mode === 'quick' ? quickDurations : fullDurations;
const life = new Lifecycle();
life.handleSignals(130);
const began = Date.now();

function say(line: string): void {
  const elapsed = ((Date.now() - began) / 1000).toFixed(0).padStart(4);
  process.stdout.write(`[drill ${elapsed} s] ${line}\n`);
}

function machine() {
  const cpu = cpus();
  return {
    cpus: cpu.length,
    cpuModel: cpu[0]?.model ?? 'unknown',
    memoryGiB: Number((totalmem() / 1024 ** 3).toFixed(1)),
    freeMemoryGiB: Number((freemem() / 1024 ** 3).toFixed(1)),
    kernel: release(),
    node: process.version,
  };
}

async function main(): Promise<void> {
  say(
    `Mode: ${mode}${mode === 'quick' ? " (short outages, for development; the figures are not the issue's)" : ' (the outages of issue 6)'}`,
  );
  const stack = new DrillStack(life, say);
  await stack.prepare();
  life.assertRunning();
  await stack.startApp();

  const db = connectDatabase(stack.env);
  await life.add('the drill\u2019s database connection', () => db.destroy());
  const firm = (await db('firms').where({ name: 'Brackenford Heating Co.' }).first('id')) as { id: number } | undefined;
  if (!firm) throw new Error('The demo firm is missing after seeding.');
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
    owner: new ApiClient(stack.baseUrl, 'owner'),
    stores: new ApiClient(stack.baseUrl, 'stores'),
    engineer: new ApiClient(stack.baseUrl, 'engineer'),
  };
  await people.owner.signIn('owner@brackenford.example', demoPassword);
  await people.stores.signIn('stores@brackenford.example', demoPassword);
  await people.engineer.signIn('engineer@brackenford.example', demoPassword);

  const acksFile = join(profile.dataDir, 'acknowledged-writes.jsonl');
  const load = new SteadyLoad({ depotId: depot.id, vanId: van.id, productIds: products }, acksFile);
  load.start(people);
  say(
    `Steady load: stores (receipts, transfers, reads), engineer (use one pack, reads), owner (reads); acknowledged writes logged to ${relative(repoRoot, acksFile)}`,
  );
  await new Promise((r) => setTimeout(r, 15_000));

  const ctx: DrillContext = {
    stack,
    load,
    db,
    firmId: firm.id,
    depotId: depot.id,
    owner: people.owner,
    stores: people.stores,
    durations,
    say,
  };
  const results: DrillResult[] = [];
  results.push(await mariadbDrill(ctx));
  results.push(await objectStoreDrill(ctx, products[0]!));
  const [smtp, redis] = await smtpAndRedisDrills(ctx);
  results.push(redis, smtp);

  await load.stop();
  const acks = await checkAcks(db, firm.id, load.acks, load.keysTried);
  const balances = await checkBalances(db);
  const emails = await emailStates(db, profile.outboxDir);
  const ok = load.samples.filter((s) => answered(s.status)).length;
  results.push({
    drill: 'Whole run',
    outage: 'all of the above',
    startedAt: new Date(began).toISOString(),
    seconds: Math.round((Date.now() - began) / 1000),
    checks: [
      check(
        'steady load answered',
        'most of it',
        `${ok} of ${load.samples.length} requests answered (the rest fell in outages)`,
        load.samples.length > 0,
      ),
      check(
        'acknowledged writes are in the database',
        'all',
        `${acks.acknowledged - acks.missing.length} of ${acks.acknowledged}; ${acks.duplicated.length} applied twice`,
        acks.missing.length === 0 && acks.duplicated.length === 0,
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
    figures: {
      requests: load.samples.length,
      answered: ok,
      acknowledgedWrites: acks.acknowledged,
      emails: emails.length,
    },
  });

  const date = new Date().toISOString().slice(0, 10);
  const outDir = join(repoRoot, 'bench', 'results');
  mkdirSync(outDir, { recursive: true });
  const outFile = join(outDir, mode === 'quick' ? `drill-${date}-quick.json` : `drill-${date}.json`);
  const failed = results.flatMap((r) => r.checks.filter((c) => !c.pass).map((c) => `${r.drill}: ${c.what}`));
  writeFileSync(
    outFile,
    `${JSON.stringify({ mode, durations, date: new Date().toISOString(), machine: machine(), passed: failed.length === 0, failed, results }, null, 2)}\n`,
  );
  process.stdout.write(`\n${renderTable(results)}\n`);
  say(
    `Mode ${mode}; ${failed.length === 0 ? 'every check passed' : `${failed.length} check(s) failed`}. JSON: ${relative(repoRoot, outFile)}`,
  );
  await life.shutdown(failed.length === 0 ? 0 : 1);
}

const run = argv.includes('--cluster') ? () => runClusterDrill(life, say, began) : main;
run().catch((error: unknown) => {
  if (life.stopping) return;
  void life.shutdown(
    1,
    `npm run drill stopped: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}`,
  );
});
