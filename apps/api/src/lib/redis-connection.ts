import { Redis, type RedisOptions } from 'ioredis';
import type { Env } from '../config/env.ts';

export type RedisSettings = Pick<Env, 'REDIS_URL' | 'REDIS_SENTINELS' | 'REDIS_SENTINEL_NAME'>;

/**
 * Every Redis client of the API and the worker comes from here: straight to REDIS_URL, or, when REDIS_SENTINELS
 * is set, to whichever server the sentinels name as the master (docker-notes/README.md, "Redis"). After a
 * failover ioredis asks the sentinels again; a connection that finds itself on a demoted master (READONLY)
 * reconnects too.
 */
export function connectRedis(settings: RedisSettings, options: RedisOptions = {}): Redis {
  if (settings.REDIS_SENTINELS.length === 0) return new Redis(settings.REDIS_URL, options);
  const url = new URL(settings.REDIS_URL);
  const db = Number(url.pathname.replace('/', '') || '0');
  return new Redis({
    ...options,
    sentinels: settings.REDIS_SENTINELS,
    name: settings.REDIS_SENTINEL_NAME,
    ...(url.password !== '' && { password: decodeURIComponent(url.password) }),
    ...(Number.isInteger(db) && { db }),
    reconnectOnError: (err) => err.message.startsWith('READONLY'),
  });
}

/** True when the server answers PING within the time given (never throws, never waits for a reconnection). */
export async function redisAnswers(redis: Redis, timeoutMs = 1_000): Promise<boolean> {
  let timer: NodeJS.Timeout | undefined;
  try {
    const timeout = new Promise<never>((_, reject) => {
      timer = setTimeout(() => reject(new Error('timed out')), timeoutMs);
    });
    return (await Promise.race([redis.ping(), timeout])) === 'PONG';
  } catch {
    return false;
  } finally {
    clearTimeout(timer);
  }
}
