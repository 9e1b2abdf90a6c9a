import type { Redis } from 'ioredis';
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import type { AppAbility, Role } from '@heatfleet/domain';
import type { Env } from './config/env.ts';
import type { Clock } from './lib/clock.ts';
import type { ObjectStore } from './lib/object-store.ts';
import type { MailQueue } from './modules/mail/mail-queue.ts';
import type { RateLimiters } from './modules/auth/rate-limits.ts';

/** What the app is built from: created once in server.ts, or per test. */
export interface AppDeps {
  env: Env;
  db: Knex;
  clock: Clock;
  logger: Logger;
  mailQueue: MailQueue;
  objectStore: ObjectStore;
  /** Limits on every route that takes a secret or sends an e-mail. */
  limiters: RateLimiters;
  /** The shared Redis of the limiters' counters (and the health check's ping). */
  redis: Redis;
}

/** The signed-in member acting in their active firm. */
export interface Actor {
  userId: number;
  firmId: number;
  memberId: number;
  role: Role;
  ability: AppAbility;
}
