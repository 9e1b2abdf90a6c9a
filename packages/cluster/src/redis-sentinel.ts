import { existsSync, mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { capture, findExecutable, startService, waitUntil, type Service } from '@heatfleet/devstack/src/processes.ts';
import { redisIsUp } from '@heatfleet/devstack/src/redis.ts';
import { cluster, type RedisNode } from './cluster-profile.ts';

function confFile(node: RedisNode): string {
  return join(node.dataDir, `${node.name}.conf`);
}

/**
 * Written once: from then on Sentinel rewrites these files itself (who is master, who replicates whom), so a
 * later start comes back with the roles as they were left, not as first written.
 */
function writeConfOnce(node: RedisNode, lines: string[]): string {
  mkdirSync(node.dataDir, { recursive: true });
  const file = confFile(node);
  if (!existsSync(file)) writeFileSync(file, `${lines.join('\n')}\n`);
  return file;
}

export function startRedisNode(node: RedisNode): Service {
  const [master] = cluster.redis;
  const file = writeConfOnce(node, [
    `port ${node.port}`,
    'bind 127.0.0.1',
    `dir ${node.dataDir}`,
    // BullMQ keeps jobs as keys: an evicted key is a lost job; the append-only file survives a restart.
    'appendonly yes',
    'maxmemory-policy noeviction',
    ...(node === master ? [] : [`replicaof 127.0.0.1 ${master!.port}`]),
  ]);
  return startService({
    name: node.name,
    command: findExecutable('redis-server'),
    args: [file],
    env: process.env,
    logFile: join(cluster.logDir, `${node.name}.log`),
    quiet: true,
  });
}

export function startSentinel(sentinel: RedisNode): Service {
  const [master] = cluster.redis;
  const m = cluster.master;
  const file = writeConfOnce(sentinel, [
    `port ${sentinel.port}`,
    'bind 127.0.0.1',
    `dir ${sentinel.dataDir}`,
    // A quorum of 2 of the 3 sentinels must agree the master is down before one of them fails it over.
    `sentinel monitor ${m.name} 127.0.0.1 ${master!.port} ${m.quorum}`,
    `sentinel down-after-milliseconds ${m.name} ${m.downAfterMs}`,
    `sentinel failover-timeout ${m.name} ${m.failoverTimeoutMs}`,
    `sentinel parallel-syncs ${m.name} 1`,
  ]);
  return startService({
    name: sentinel.name,
    command: findExecutable('redis-server'),
    args: [file, '--sentinel'],
    env: process.env,
    logFile: join(cluster.logDir, `${sentinel.name}.log`),
    quiet: true,
  });
}

export async function waitForRedis(node: RedisNode): Promise<void> {
  await waitUntil(`${node.name} on ${node.port}`, () => redisIsUp(node), { timeoutMs: 20_000, intervalMs: 100 });
}

/** The master's port as the first sentinel that answers names it. */
export async function currentMasterPort(): Promise<number | null> {
  for (const sentinel of cluster.sentinels) {
    const result = await capture(findExecutable('redis-cli'), [
      '-p',
      String(sentinel.port),
      'sentinel',
      'get-master-addr-by-name',
      cluster.master.name,
    ]);
    const port = Number(result.stdout.trim().split('\n')[1]);
    if (result.code === 0 && Number.isInteger(port) && port > 0) return port;
  }
  return null;
}

/** The role a Redis server reports of itself (master or slave), or null when it does not answer. */
export async function redisRole(node: RedisNode): Promise<string | null> {
  const result = await capture(findExecutable('redis-cli'), ['-p', String(node.port), 'role']);
  return result.code === 0 ? (result.stdout.trim().split('\n')[0] ?? null) : null;
}
