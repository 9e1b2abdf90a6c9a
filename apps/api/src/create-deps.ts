import type { AppDeps } from './app-deps.ts';
import type { Env } from './config/env.ts';
import { createKnex } from './db/knex.ts';
import { systemClock, type Clock } from './lib/clock.ts';
import { createLogger } from './lib/logger.ts';
import { createObjectStore } from './lib/object-store.ts';
import { createRateLimiters, type RateLimits } from './modules/auth/rate-limits.ts';
import { createMailQueue } from './modules/mail/mail-queue.ts';

export function createDeps(env: Env, overrides: { clock?: Clock; limits?: Partial<RateLimits> } = {}): AppDeps {
  const logger = createLogger(env.LOG_LEVEL);
  return {
    env,
    logger,
    db: createKnex(env, logger),
    clock: overrides.clock ?? systemClock,
    mailQueue: createMailQueue(env.REDIS_URL, logger),
    objectStore: createObjectStore(env),
    limiters: createRateLimiters(overrides.limits),
  };
}

export async function closeDeps(deps: AppDeps): Promise<void> {
  await deps.mailQueue.close();
  await deps.db.destroy();
}
