import { mkdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { setTimeout as sleep } from 'node:timers/promises';
import { capture, findExecutable, isAlive, lastLines, portIsFree, waitUntil } from './processes.ts';

export interface RedisOptions {
  dataDir: string;
  port: number;
  timeoutMs?: number;
}

export interface RedisInstance {
  dataDir: string;
  port: number;
  pid: number | null;
  /** False when a server already answered on the port: then the caller must leave it running. */
  startedHere: boolean;
  startMs: number;
}

function pidFile(dataDir: string): string {
  return join(dataDir, 'redis-server.pid');
}

export function redisLogFile(dataDir: string): string {
  return join(dataDir, 'redis-server.log');
}

function readPid(dataDir: string): number | null {
  try {
    const pid = Number(readFileSync(pidFile(dataDir), 'utf8').trim());
    return Number.isInteger(pid) && pid > 0 ? pid : null;
  } catch {
    return null;
  }
}

async function redisCli(port: number, args: string[]): Promise<{ code: number; output: string }> {
  const result = await capture(findExecutable('redis-cli'), ['-h', '127.0.0.1', '-p', String(port), ...args], {
    timeoutMs: 10_000,
  });
  return { code: result.code, output: `${result.stdout}${result.stderr}`.trim() };
}

export async function redisIsUp(target: { port: number }): Promise<boolean> {
  const { code, output } = await redisCli(target.port, ['ping']);
  return code === 0 && output === 'PONG';
}

/** Starts a private redis-server (AOF on, no eviction, as BullMQ needs), or reuses one already on the port. */
export async function startRedis(options: RedisOptions): Promise<RedisInstance> {
  const instance: RedisInstance = {
    dataDir: options.dataDir,
    port: options.port,
    pid: null,
    startedHere: false,
    startMs: 0,
  };
  if (await redisIsUp(options)) {
    instance.pid = readPid(options.dataDir);
    return instance;
  }
  // Daemonised, redis-server reports a taken port only in its log, after we would have waited the full timeout.
  if (!(await portIsFree(options.port))) {
    throw new Error(`Port ${options.port} (Redis) is in use by something that does not answer as Redis.`);
  }
  mkdirSync(options.dataDir, { recursive: true });
  const began = Date.now();
  const result = await capture(findExecutable('redis-server'), [
    '--bind',
    '127.0.0.1',
    '--port',
    String(options.port),
    '--dir',
    options.dataDir,
    '--appendonly',
    'yes',
    '--maxmemory-policy',
    'noeviction',
    '--daemonize',
    'yes',
    '--pidfile',
    pidFile(options.dataDir),
    '--logfile',
    redisLogFile(options.dataDir),
  ]);
  if (result.code !== 0) {
    throw new Error(`redis-server failed to start (exit ${result.code}): ${result.stdout}${result.stderr}`.trim());
  }
  try {
    await waitUntil(`Redis on port ${options.port}`, () => redisIsUp(options), {
      timeoutMs: options.timeoutMs ?? 20_000,
      intervalMs: 50,
    });
  } catch (error) {
    const logFile = redisLogFile(options.dataDir);
    throw new Error(`${(error as Error).message}\nLast lines of ${logFile}:\n${lastLines(logFile)}`, { cause: error });
  }
  instance.startMs = Date.now() - began;
  instance.pid = readPid(options.dataDir);
  instance.startedHere = true;
  return instance;
}

/** Saves and stops the server (redis-cli shutdown), then waits for the process to go. */
export async function stopRedis(target: { port: number; dataDir: string }, timeoutMs = 20_000): Promise<void> {
  const pid = readPid(target.dataDir);
  if (!(await redisIsUp(target))) return;
  // redis-cli reports the dropped connection of a successful shutdown as an error, so judge by the outcome.
  await redisCli(target.port, ['shutdown']);
  const deadline = Date.now() + timeoutMs;
  while ((pid !== null && isAlive(pid)) || (await redisIsUp(target))) {
    if (Date.now() > deadline)
      throw new Error(`Redis on port ${target.port} did not stop within ${timeoutMs / 1000} s.`);
    await sleep(50);
  }
}

/** Empties every key (queues included): for the test profile between phases. */
export async function flushRedis(target: { port: number }): Promise<void> {
  const { code, output } = await redisCli(target.port, ['flushall']);
  if (code !== 0 || output !== 'OK') throw new Error(`Redis FLUSHALL failed: ${output}`);
}
