import { setTimeout as sleep } from 'node:timers/promises';
import { createConnection } from 'mysql2/promise';
import { cluster, type GaleraNode } from '@heatfleet/cluster/src/cluster-profile.ts';
import { errorLogMark, errorLogSince, isSynced, nodePid, wsrepStatus } from '@heatfleet/cluster/src/galera.ts';
import { check, percent, type DrillResult } from './drill-report.ts';
import { answered, samplesBetween } from './steady-load.ts';
import { currentWriter } from './cluster-drills.ts';
import { describeCounts, ledgerChecks, seconds, type ClusterDrillContext } from './cluster-context.ts';

const pauseMs = 60_000;

interface Read {
  at: number;
  outcome: 'refused' | 'fresh' | 'stale';
  detail: string;
}

/** One read straight from the node (not through HAProxy), as a client that bypassed the proxy would make. */
async function readFrom(node: GaleraNode, env: Record<string, string>, latest: number): Promise<Read> {
  const at = Date.now();
  try {
    const connection = await createConnection({
      host: '127.0.0.1',
      port: node.sqlPort,
      user: env.DATABASE_USER,
      password: env.DATABASE_PASSWORD,
      database: env.DATABASE_NAME,
      connectTimeout: 3_000,
    });
    try {
      const [rows] = await connection.query({ sql: 'SELECT MAX(id) AS id FROM stock_movements', timeout: 5_000 });
      const id = Number((rows as { id: number | null }[])[0]?.id ?? 0);
      return { at, outcome: id >= latest ? 'fresh' : 'stale', detail: `max id ${id}` };
    } finally {
      connection.destroy();
    }
  } catch (err) {
    return { at, outcome: 'refused', detail: err instanceof Error ? err.message.slice(0, 120) : String(err) };
  }
}

/**
 * A network partition of one node, made by freezing it (SIGSTOP) for 60 s: the other two keep the primary component
 * and go on serving; once it resumes it must not answer from the state it was frozen in. Its reads wait for the
 * cluster (wsrep_sync_wait=1), so until it has rejoined and caught up they are refused, never stale.
 */
export async function galeraPauseDrill(ctx: ClusterDrillContext): Promise<DrillResult> {
  const startedAt = Date.now();
  const writer = await currentWriter();
  const target = [...cluster.galera].reverse().find((n) => n !== writer);
  const pid = target ? nodePid(target) : null;
  if (!writer || !target || pid === null) throw new Error('No writer, or no other node running, before the pause.');
  const mark = errorLogMark(target);
  ctx.say(`Galera: SIGSTOP ${target.name} (pid ${pid}) for ${seconds(pauseMs)}; ${writer.name} takes the writes…`);
  const pausedAt = Date.now();
  process.kill(pid, 'SIGSTOP');
  await sleep(30_000);
  const during = await wsrepStatus(writer);
  await sleep(Math.max(0, pausedAt + pauseMs - Date.now()));
  const latest = Number(((await ctx.db('stock_movements').max({ id: 'id' }).first()) as { id: number | null }).id ?? 0);
  process.kill(pid, 'SIGCONT');
  const resumedAt = Date.now();
  const reads: Read[] = [];
  let syncedAt: number | null = null;
  while (Date.now() - resumedAt < 120_000) {
    reads.push(await readFrom(target, ctx.stack.env, latest));
    if (syncedAt === null && (await isSynced(target))) syncedAt = Date.now();
    if (syncedAt !== null && reads.filter((r) => r.outcome === 'fresh').length >= 3) break;
    await sleep(200);
  }
  const log = errorLogSince(target, mark);
  // MariaDB runs its rsync script for IST too; a full copy says "rsync SST completed".
  const byIst = /IST received/.test(log) && !/rsync SST completed/.test(log);
  ctx.say(
    `Galera: ${target.name} resumed; ${reads.filter((r) => r.outcome === 'refused').length} reads refused, ${reads.filter((r) => r.outcome === 'stale').length} stale; synced ${syncedAt === null ? 'never' : seconds(syncedAt - resumedAt)} after`,
  );
  await sleep(5_000);

  const pausedWindow = samplesBetween(ctx.load.samples, pausedAt, resumedAt);
  const pausedOk = pausedWindow.filter((s) => answered(s.status));
  const stale = reads.filter((r) => r.outcome === 'stale');
  const firstFresh = reads.find((r) => r.outcome === 'fresh');
  const ledger = await ledgerChecks(ctx);
  return {
    drill: 'Galera node paused',
    outage: `SIGSTOP of ${target.name} (not the writer) for ${seconds(resumedAt - pausedAt)}, then SIGCONT`,
    startedAt: new Date(startedAt).toISOString(),
    seconds: Math.round((Date.now() - startedAt) / 1000),
    checks: [
      check(
        'the other two keep the primary component',
        'Primary, size 2',
        `${writer.name}: ${during.wsrep_cluster_status}, size ${during.wsrep_cluster_size}, state ${during.wsrep_local_state_comment}`,
        during.wsrep_cluster_status === 'Primary' && during.wsrep_cluster_size === '2',
      ),
      check(
        '... and serve',
        '>= 99% answered while it is frozen',
        `${percent(pausedOk.length, pausedWindow.length)} of ${pausedWindow.length} (${describeCounts(pausedWindow)})`,
        pausedWindow.length > 0 && pausedOk.length / pausedWindow.length >= 0.99,
      ),
      check(
        'no stale read from the resumed node',
        '0 stale; refused until caught up',
        `${stale.length} stale of ${reads.length} reads straight from it (${reads.filter((r) => r.outcome === 'refused').length} refused${reads[0] ? `, first: ${reads[0].outcome} "${reads[0].detail}"` : ''}); first fresh ${firstFresh ? seconds(firstFresh.at - resumedAt) : 'never'} after SIGCONT`,
        stale.length === 0 && firstFresh !== undefined,
      ),
      check(
        'it rejoins and catches up',
        'synced, by IST',
        `${syncedAt === null ? 'not synced' : `synced ${seconds(syncedAt - resumedAt)} after SIGCONT`}; ${byIst ? 'by IST' : 'no IST in its log'}`,
        syncedAt !== null && byIst,
      ),
      ...ledger.checks,
    ],
    figures: {
      node: target.name,
      writer: writer.name,
      writerStatusWhilePaused: {
        status: during.wsrep_cluster_status,
        size: during.wsrep_cluster_size,
        state: during.wsrep_local_state_comment,
      },
      latestIdBeforeResume: latest,
      reads: reads.length,
      refused: reads.filter((r) => r.outcome === 'refused').length,
      firstReads: reads.slice(0, 5),
      firstFreshMs: firstFresh ? firstFresh.at - resumedAt : null,
      syncedMs: syncedAt === null ? null : syncedAt - resumedAt,
      ...ledger.figures,
    },
  };
}
