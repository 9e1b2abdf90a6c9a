import { setTimeout as sleep } from 'node:timers/promises';
import { demoPassword } from '@heatfleet/devstack/src/demo-accounts.ts';
import { cluster } from '@heatfleet/cluster/src/cluster-profile.ts';
import { currentMasterPort, redisRole } from '@heatfleet/cluster/src/redis-sentinel.ts';
import { ApiClient } from './api-client.ts';
import { emailStates } from './checks.ts';
import { check, percent, quantile, type DrillResult } from './drill-report.ts';
import { answered, samplesBetween } from './steady-load.ts';
import { describeCounts, seconds, timeUntil, type ClusterDrillContext } from './cluster-context.ts';

/**
 * kill -9 of the Redis master while invitations (e-mails) are written and reminders fall due: Sentinel promotes the
 * replica, the API and the workers follow it, and every e-mail goes exactly once (each is a row first; the worker's
 * sweep re-queues any whose job was lost with the old master).
 */
export async function redisMasterDrill(ctx: ClusterDrillContext): Promise<DrillResult> {
  const startedAt = Date.now();
  const masterPort = await currentMasterPort();
  const master = cluster.redis.find((r) => r.port === masterPort);
  const service = master ? ctx.stack.redis.get(master.name) : undefined;
  if (!master || !service) throw new Error(`The sentinels name no master of ours (${masterPort}).`);
  const lastEmailId = Number(((await ctx.db('emails').max({ id: 'id' }).first()) as { id: number | null }).id ?? 0);

  const invitations: { status: number; at: number }[] = [];
  let inviting = true;
  const invitingLoop = (async () => {
    for (let n = 1; inviting; n += 1) {
      const answer = await ctx.owner.post('/api/invitations', {
        email: `cluster-invitee-${startedAt.toString(36)}-${n}@drill.example`,
        role: 'engineer',
      });
      invitations.push({ status: answer.status, at: Date.now() });
      await sleep(2_000);
    }
  })();
  await sleep(6_000);
  ctx.say(`Redis: kill -9 the master ${master.name} (port ${master.port})…`);
  const killedAt = Date.now();
  process.kill(service.pid, 'SIGKILL');
  const promotedMs = await timeUntil(async () => {
    const port = await currentMasterPort();
    return port !== null && port !== master.port;
  }, 30_000);
  const newMaster = await currentMasterPort();
  ctx.say(`Redis: Sentinel promoted ${newMaster} after ${promotedMs === null ? 'never' : seconds(promotedMs)}`);

  // Reminders fall due right after the failover: two kit items past their inspection, then "scan now".
  const kind = (await ctx
    .db('item_kinds')
    .where({ firm_id: ctx.firmId })
    .whereNotNull('interval_days')
    .orderBy('id')
    .first('id')) as { id: number };
  const tag = `C${(startedAt % 1_000_000).toString(36).toUpperCase()}`;
  const items: number[] = [];
  for (const label of ['R1', 'R2']) {
    const answer = await ctx.owner.post('/api/kit-items', {
      assetTag: `${tag}-${label}`,
      kindId: kind.id,
      locationId: ctx.depotId,
      inServiceSince: '2024-01-02',
    });
    const id = (answer.body as { item?: { id: number } } | null)?.item?.id;
    if (id !== undefined) items.push(id);
  }
  const scan = await ctx.owner.post('/api/reminders/scan', {});
  await sleep(Math.max(0, killedAt + 30_000 - Date.now()));
  inviting = false;
  await invitingLoop;
  await ctx.stack.startRedisNode(master);
  const asReplicaMs = await timeUntil(async () => (await redisRole(master)) === 'slave', 30_000, 500);
  ctx.say(`Redis: ${master.name} back as ${(await redisRole(master)) ?? 'nothing'}; waiting for every e-mail…`);

  const newer = (q: import('knex').Knex.QueryBuilder) => void q.where('id', '>', lastEmailId);
  let states = await emailStates(ctx.db, cluster.outboxDir, newer);
  const deadline = Date.now() + 180_000;
  while (Date.now() < deadline && states.some((s) => s.sentAt === null || s.caught === 0)) {
    await sleep(2_000);
    states = await emailStates(ctx.db, cluster.outboxDir, newer);
  }
  const reminders = (await ctx
    .db('reminders')
    .where({ firm_id: ctx.firmId, subject_type: 'kit_item' })
    .whereIn('subject_id', items)
    .select('id', 'subject_id')) as { id: number; subject_id: number }[];
  const sent = states.filter((s) => s.sentAt !== null);
  const twice = states.filter((s) => s.caught > 1);
  const afterPromotion = states.filter((s) => s.createdAt > killedAt + (promotedMs ?? 0) && s.sentAt !== null);
  const delays = afterPromotion.map((s) => s.sentAt! - s.createdAt);
  const window = samplesBetween(ctx.load.samples, killedAt, killedAt + 30_000);
  const windowOk = window.filter((s) => answered(s.status));
  const invitesOk = invitations.filter((i) => i.status === 201);
  return {
    drill: 'Redis master killed',
    outage: `kill -9 of ${master.name}, restarted after ${seconds(30_000)}`,
    startedAt: new Date(startedAt).toISOString(),
    seconds: Math.round((Date.now() - startedAt) / 1000),
    checks: [
      check(
        'Sentinel promotes the replica',
        'within 10 s',
        promotedMs === null ? 'never' : `${seconds(promotedMs)} (now ${newMaster})`,
        promotedMs !== null && promotedMs <= 10_000,
      ),
      check(
        'the API keeps serving meanwhile',
        '>= 99% answered',
        `${percent(windowOk.length, window.length)} of ${window.length} (${describeCounts(window)})`,
        window.length > 0 && windowOk.length / window.length >= 0.99,
      ),
      check(
        'invitations accepted throughout',
        'all 201',
        `${invitesOk.length} of ${invitations.length}`,
        invitations.length > 0 && invitesOk.length === invitations.length,
      ),
      check(
        'reminders recorded once',
        '1 per item, scan 200',
        `scan ${scan.status}; ${items.map((id) => reminders.filter((r) => r.subject_id === id).length).join(', ')}`,
        scan.status === 200 &&
          items.length === 2 &&
          items.every((id) => reminders.filter((r) => r.subject_id === id).length === 1),
      ),
      check(
        'no e-mail lost or doubled',
        'all sent, each received once',
        `${sent.length} of ${states.length} sent (${states.filter((s) => s.purpose === 'reminder').length} reminders); ${twice.length} received twice; after the promotion sent within ${seconds(Math.max(0, ...delays))} (median ${seconds(quantile(delays, 0.5))})`,
        states.length > 0 && states.every((s) => s.sentAt !== null && s.caught === 1),
      ),
      check(
        'the old master returns as a replica',
        'role slave',
        asReplicaMs === null ? 'not a replica' : `replica ${seconds(asReplicaMs)} after its restart`,
        asReplicaMs !== null,
      ),
    ],
    figures: {
      oldMaster: master.port,
      newMaster,
      promotedMs,
      emails: states.length,
      invitations: invitations.length,
      deliveryAfterPromotionMs: delays,
    },
  };
}

/** The same failed sign-ins spread over the three replicas are limited as they would be on one. */
export async function limiterDrill(ctx: ClusterDrillContext): Promise<DrillResult> {
  const startedAt = Date.now();
  const email = `limit-probe-${startedAt.toString(36)}@drill.example`;
  const replicas = cluster.apiPorts.map((port) => new ApiClient(`http://127.0.0.1:${port}`, `replica ${port}`));
  for (const r of replicas) await r.get('/api/auth/csrf');
  const perAccount = 10;
  const failures: number[] = [];
  for (let i = 0; i < perAccount; i += 1) {
    failures.push(
      (await replicas[i % 3]!.post('/api/auth/sign-in', { email, password: `wrong-${i}-${demoPassword}` })).status,
    );
  }
  const next = [];
  for (const r of replicas) next.push((await r.post('/api/auth/sign-in', { email, password: 'still wrong' })).status);
  ctx.say(`Limiter: ${failures.join(' ')} then ${next.join(' ')}`);
  return {
    drill: 'Sign-in limiter',
    outage: `${perAccount} failed sign-ins for one account spread over ${replicas.length} replicas`,
    startedAt: new Date(startedAt).toISOString(),
    seconds: Math.round((Date.now() - startedAt) / 1000),
    checks: [
      check(
        'the first failures answered',
        `${perAccount}x 401`,
        failures.join(' '),
        failures.every((s) => s === 401),
      ),
      check(
        'then every replica refuses',
        '429 on each',
        next.join(' '),
        next.every((s) => s === 429),
      ),
    ],
    figures: { failures, next },
  };
}
