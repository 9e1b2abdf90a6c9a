import { Queue } from 'bullmq';
import { connectRedis, type RedisSettings } from '../../lib/redis-connection.ts';
import type { Logger } from 'pino';

export const EMAIL_QUEUE = 'email';

export interface MailQueue {
  /** Asks the worker to deliver stored e-mails now; if Redis is down the sweep delivers them later. */
  notify(emailIds: number[]): Promise<void>;
  close(): Promise<void>;
}

/**
 * Retries span an SMTP outage of a quarter of an hour without hammering the relay: doubling from 5 s,
 * capped at 2 minutes, so an e-mail goes within 2 minutes of the relay's return. After the last
 * attempt the minute sweep queues it afresh, so nothing is ever given up on.
 */
export const EMAIL_RETRY = { attempts: 12, firstDelayMs: 5_000, maxDelayMs: 120_000 } as const;
export const EMAIL_BACKOFF_TYPE = 'email-capped-exponential';

/** The wait before retry number `attemptsMade` (BullMQ's custom backoff strategy, set on the worker). */
export function emailRetryDelayMs(attemptsMade: number): number {
  return Math.min(EMAIL_RETRY.firstDelayMs * 2 ** Math.max(attemptsMade - 1, 0), EMAIL_RETRY.maxDelayMs);
}

/**
 * One delivery job per e-mail at a time: the API's notify and the sweep both deduplicate on the e-mail
 * id, so a job waiting out its backoff is not joined by a new one every sweep. The key goes when the job
 * finishes; a job left over from before a database reset only carries the id, so it delivers whichever
 * e-mail has that id now. A duplicate that slips through is harmless, since a delivery claims its row first.
 */
export function deliverJob(emailId: number) {
  return {
    name: 'deliver',
    data: { emailId },
    opts: {
      attempts: EMAIL_RETRY.attempts,
      backoff: { type: EMAIL_BACKOFF_TYPE },
      deduplication: { id: `email-${emailId}` },
      removeOnComplete: true,
      removeOnFail: 1000,
    },
  };
}

export function createMailQueue(redis: RedisSettings, logger: Logger): MailQueue {
  // enableOfflineQueue false: with Redis down, add() fails at once instead of holding the request.
  const connection = connectRedis(redis, { enableOfflineQueue: false, maxRetriesPerRequest: 1, lazyConnect: false });
  connection.on('error', (err) => logger.debug({ err }, 'mail queue: redis error'));
  const queue = new Queue(EMAIL_QUEUE, { connection });
  queue.on('error', (err) => logger.debug({ err }, 'mail queue error'));
  return {
    async notify(emailIds) {
      try {
        await queue.addBulk(emailIds.map(deliverJob));
      } catch (err) {
        logger.warn({ err, emailIds }, 'could not queue e-mail; the sweep will deliver it');
      }
    },
    async close() {
      await queue.close();
      connection.disconnect();
    },
  };
}
