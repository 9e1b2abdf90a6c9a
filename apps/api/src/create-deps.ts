import { randomUUID } from 'node:crypto';
import type { Logger } from 'pino';
import type { AppDeps } from './app-deps.ts';
import type { Env } from './config/env.ts';
import { createKnex } from './db/knex.ts';
import { systemClock, type Clock } from './lib/clock.ts';
import { createLogger } from './lib/logger.ts';
import { createObjectStore } from './lib/object-store.ts';
import { connectRedis } from './lib/redis-connection.ts';
import { createRateLimiters, type LimitStoreFactory, type RateLimits } from './modules/auth/rate-limits.ts';
import { SharedLimitStore } from './modules/auth/shared-limit-store.ts';
import { createMailQueue } from './modules/mail/mail-queue.ts';

/**
 * The limiters count on the shared Redis under one prefix per deployment. Each test app counts under its own
 * (tests share one Redis and one client address), unless the test names the prefix to share it.
 */
function limitStores(env: Env, redis: AppDeps['redis'], logger: Logger): LimitStoreFactory {
  const prefix = env.RATE_LIMIT_PREFIX ?? (env.NODE_ENV === 'test' ? `hf:rl:test-${randomUUID()}:` : 'hf:rl:');
  let warnedAt = 0;
  const onFallback = (err: unknown) => {
    if (Date.now() - warnedAt < 60_000) return;
    warnedAt = Date.now();
    logger.warn(
      { err: err instanceof Error ? err.message : String(err) },
      'rate limits: Redis unreachable, counting in memory',
    );
  };
  return (name) => new SharedLimitStore(redis, `${prefix}${name}:`, onFallback);
}

export function createDeps(env: Env, overrides: { clock?: Clock; limits?: Partial<RateLimits> } = {}): AppDeps {
  const logger = createLogger(env.LOG_LEVEL);
  // enableOfflineQueue false: with Redis down a count falls back at once instead of holding the request.
  const redis = connectRedis(env, { enableOfflineQueue: false, maxRetriesPerRequest: 1 });
  redis.on('error', (err) => logger.debug({ err }, 'shared redis error'));
  return {
    env,
    logger,
    db: createKnex(env, logger),
    clock: overrides.clock ?? systemClock,
    mailQueue: createMailQueue(env, logger),
    objectStore: createObjectStore(env),
    limiters: createRateLimiters(
      {
        ...(env.SIGN_UPS_PER_ADDRESS_PER_HOUR ? { signUpsPerAddress: env.SIGN_UPS_PER_ADDRESS_PER_HOUR } : {}),
        ...overrides.limits,
      },
      limitStores(env, redis, logger),
    ),
    redis,
  };
}

export async function closeDeps(deps: AppDeps): Promise<void> {
  await deps.mailQueue.close();
  deps.redis.disconnect();
  await deps.db.destroy();
}
