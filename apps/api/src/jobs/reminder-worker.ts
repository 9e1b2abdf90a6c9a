import { Queue, Worker } from 'bullmq';
import { DEFAULT_TIME_ZONE } from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import type { Env } from '../config/env.ts';
import type { Clock } from '../lib/clock.ts';
import { connectRedis } from '../lib/redis-connection.ts';
import { createMailQueue } from '../modules/mail/mail-queue.ts';
import { runDueScans } from '../modules/reminders/reminder-scan.ts';

export const REMINDER_QUEUE = 'reminders';
// On the hour, every hour: each firm's own scan hour (in its own zone) is checked by the sweep.
export const REMINDER_SWEEP_CRON = { pattern: '0 * * * *', tz: DEFAULT_TIME_ZONE };

/**
 * The reminder sweep: a BullMQ job scheduler runs it hourly, and it is queued once at start, so a
 * day missed while no worker was running is caught up as soon as one is. Duplicated or overlapping
 * sweeps are harmless: each firm's scan locks the firm and a reminder is recorded once per period.
 * `firmIds` limits the sweep to those firms (tests share the database with other test files).
 */
export function startReminderWorker(deps: { env: Env; db: Knex; logger: Logger; clock: Clock; firmIds?: number[] }) {
  const connection = connectRedis(deps.env, { maxRetriesPerRequest: null });
  connection.on('error', (err) => deps.logger.warn({ err: err.message }, 'reminder worker: redis error'));
  const queue = new Queue(REMINDER_QUEUE, { connection });
  const mailQueue = createMailQueue(deps.env, deps.logger);
  const scanDeps = { db: deps.db, mailQueue, env: deps.env, logger: deps.logger };

  const worker = new Worker(
    REMINDER_QUEUE,
    async () => runDueScans(scanDeps, deps.clock.now(), deps.firmIds),
    // One sweep at a time is plenty: a sweep only reads a few rows per firm that is not due.
    { connection, concurrency: 1 },
  );
  worker.on('failed', (job, err) => deps.logger.warn({ jobId: job?.id, err: err.message }, 'reminder sweep failed'));
  worker.on('error', (err) => deps.logger.warn({ err: err.message }, 'reminder worker error'));

  const sweepJob = { name: 'sweep', data: {}, opts: { removeOnComplete: 100, removeOnFail: 100 } };
  const scheduled = Promise.all([
    queue.upsertJobScheduler('reminder-sweep', REMINDER_SWEEP_CRON, sweepJob),
    queue.add('sweep', {}, { removeOnComplete: 100, removeOnFail: 100 }),
  ]).catch((err: unknown) => deps.logger.warn({ err }, 'could not schedule the reminder sweep'));

  return {
    worker,
    queue,
    /** Resolves when the scheduler is in Redis and the start-up sweep is queued. */
    ready: scheduled.then(() => undefined),
    async close() {
      await scheduled;
      await worker.close();
      await queue.close();
      await mailQueue.close();
      connection.disconnect();
    },
  };
}
