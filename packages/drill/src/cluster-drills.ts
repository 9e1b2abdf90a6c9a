import { setTimeout as sleep } from 'node:timers/promises';
import { cluster, type GaleraNode } from '@heatfleet/cluster/src/cluster-profile.ts';
import { errorLogMark, errorLogSince, killNode, startNode } from '@heatfleet/cluster/src/galera.ts';
import { haproxyServerStates } from '@heatfleet/cluster/src/haproxy.ts';
import { check, percent, type DrillResult } from './drill-report.ts';
import { answered, samplesBetween } from './steady-load.ts';
import {
  describeCounts,
  ledgerChecks,
  seconds,
  statusCounts,
  timeUntil,
  type ClusterDrillContext,
} from './cluster-context.ts';

const isUp = (state: string | undefined) => state?.startsWith('UP') === true;
const isDown = (state: string | undefined) => state?.startsWith('DOWN') === true;

/** The node HAProxy sends the writes to: the first one UP, the non-backup first (HAProxy's own order). */
export async function currentWriter(): Promise<GaleraNode | null> {
  const states = await haproxyServerStates();
  return cluster.galera.find((n) => isUp(states[`galera/${n.name}`])) ?? null;
}

export async function galeraWriterDrill(ctx: ClusterDrillContext): Promise<DrillResult> {
  const startedAt = Date.now();
  const writer = await currentWriter();
  if (!writer) throw new Error('HAProxy has no Galera node UP before the drill.');
  const mark = errorLogMark(writer);
  ctx.say(`Galera: kill -9 the writer ${writer.name}; back in 20 s…`);
  const killedAt = Date.now();
  await killNode(writer);
  const movedMs = await timeUntil(async () => {
    const next = await currentWriter();
    return next !== null && next !== writer;
  }, 30_000);
  const next = await currentWriter();
  ctx.say(
    `Galera: HAProxy moved the writes to ${next?.name ?? 'nothing'} after ${movedMs === null ? 'never' : seconds(movedMs)}`,
  );
  await sleep(Math.max(0, killedAt + 20_000 - Date.now()));
  const restartAt = Date.now();
  const rejoin = await startNode(writer, { bootstrap: false });
  const log = errorLogSince(writer, mark);
  // MariaDB runs its rsync script for IST too; a full copy says "rsync SST completed".
  const byIst = /IST received/.test(log) && !/rsync SST completed/.test(log);
  const events = /Receiving IST\.\.\.\s+100\.0% \((\d+)\/\d+ events\)/.exec(log)?.[1];
  ctx.say(
    `Galera: ${writer.name} rejoined in ${seconds(rejoin.ms)} (${byIst ? `IST, ${events ?? '?'} events` : 'not by IST'})`,
  );
  // Back as the first server, it takes the writes again (the backup's connections are cut).
  const failbackMs = await timeUntil(async () => (await currentWriter()) === writer, 30_000);
  await sleep(15_000);

  const gapEnd = killedAt + (movedMs ?? 30_000) + 2_000;
  const gap = samplesBetween(ctx.load.samples, killedAt, gapEnd);
  const gapRefused = gap.filter((s) => !answered(s.status));
  const unexpected = gapRefused.filter((s) => s.status !== 503 && s.status !== 502);
  const firstAck = ctx.load.acks.find((a) => a.at > killedAt);
  const after = samplesBetween(ctx.load.samples, gapEnd, restartAt);
  const afterOk = after.filter((s) => answered(s.status));
  const ledger = await ledgerChecks(ctx);
  return {
    drill: 'Galera writer killed',
    outage: `kill -9 of ${writer.name} (the writer), restarted after ${seconds(restartAt - killedAt)}`,
    startedAt: new Date(startedAt).toISOString(),
    seconds: Math.round((Date.now() - startedAt) / 1000),
    checks: [
      check(
        'HAProxy moves the writes to another node',
        'within 10 s',
        movedMs === null ? 'never' : `${seconds(movedMs)} (to ${next?.name})`,
        movedMs !== null && movedMs <= 10_000,
      ),
      check(
        'requests in the gap refused plainly',
        '503 (or 502), retried with the same key',
        `${gapRefused.length} of ${gap.length} refused (${describeCounts(gapRefused) || 'none'}); first write acknowledged ${firstAck ? seconds(firstAck.at - killedAt) : 'never'} after the kill`,
        unexpected.length === 0,
      ),
      check(
        'served by the other nodes meanwhile',
        '>= 99% answered',
        `${percent(afterOk.length, after.length)} of ${after.length} (${describeCounts(after)})`,
        after.length > 0 && afterOk.length / after.length >= 0.99,
      ),
      check(
        'the node rejoins by incremental state transfer',
        'IST, synced',
        `${byIst ? `IST of ${events ?? '?'} write sets` : 'no IST in its log'}; synced ${seconds(rejoin.ms)} after its restart; writes back on it after ${failbackMs === null ? 'never' : seconds(failbackMs)}`,
        byIst && failbackMs !== null,
      ),
      ...ledger.checks,
    ],
    figures: {
      writer: writer.name,
      movedToMs: movedMs,
      movedTo: next?.name ?? null,
      gapStatuses: statusCounts(gap),
      firstAckAfterKillMs: firstAck ? firstAck.at - killedAt : null,
      rejoinMs: rejoin.ms,
      istEvents: events ? Number(events) : null,
      failbackMs,
      ...ledger.figures,
    },
  };
}

export async function apiReplicaDrill(ctx: ClusterDrillContext): Promise<DrillResult> {
  const startedAt = Date.now();
  const index = 1;
  const name = `api${index + 1}`;
  const service = ctx.stack.apis[index]!;
  ctx.say(`API: kill -9 ${name} (pid ${service.pid})…`);
  const killedAt = Date.now();
  process.kill(service.pid, 'SIGKILL');
  const downMs = await timeUntil(async () => isDown((await haproxyServerStates())[`api/${name}`]), 30_000);
  await sleep(Math.max(0, killedAt + 20_000 - Date.now()));
  const restartAt = Date.now();
  ctx.stack.startApi(index);
  await ctx.stack.waitForApi(index);
  const upMs = await timeUntil(async () => isUp((await haproxyServerStates())[`api/${name}`]), 30_000);
  ctx.say(
    `API: ${name} marked down after ${downMs === null ? 'never' : seconds(downMs)}; back after ${seconds(Date.now() - restartAt)}`,
  );
  await sleep(5_000);

  const markedAt = killedAt + (downMs ?? 20_000);
  const detecting = samplesBetween(ctx.load.samples, killedAt, markedAt);
  const routedAround = samplesBetween(ctx.load.samples, markedAt, restartAt);
  const routedOk = routedAround.filter((s) => answered(s.status));
  const signedOut = samplesBetween(ctx.load.samples, killedAt, Date.now()).filter((s) => s.status === 401);
  const ledger = await ledgerChecks(ctx);
  return {
    drill: 'API replica killed',
    outage: `kill -9 of ${name}, restarted after ${seconds(restartAt - killedAt)}`,
    startedAt: new Date(startedAt).toISOString(),
    seconds: Math.round((Date.now() - startedAt) / 1000),
    checks: [
      check(
        'the balancer takes it out',
        'within 5 s',
        downMs === null ? 'never' : seconds(downMs),
        downMs !== null && downMs <= 5_000,
      ),
      check(
        'routed around it',
        '100% answered once out',
        `${percent(routedOk.length, routedAround.length)} of ${routedAround.length}; before it was out: ${describeCounts(detecting)}`,
        routedAround.length > 0 && routedOk.length === routedAround.length,
      ),
      check(
        'sessions carry on (they live in the database)',
        'no 401',
        `${signedOut.length} answers 401`,
        signedOut.length === 0,
      ),
      check(
        'back in the balancer after its restart',
        'UP',
        upMs === null ? 'not UP' : `UP ${seconds(upMs)} after its health answered`,
        upMs !== null,
      ),
      ...ledger.checks,
    ],
    figures: {
      markedDownMs: downMs,
      detectingStatuses: statusCounts(detecting),
      routedAround: routedAround.length,
      ...ledger.figures,
    },
  };
}
