import { Queue } from 'bullmq';
import { Redis } from 'ioredis';
import type { Logger } from 'pino';

export const EMAIL_QUEUE = 'email';

export interface MailQueue {
  /** Asks the worker to deliver stored e-mails now; if Redis is down the sweep delivers them later. */
  notify(emailIds: number[]): Promise<void>;
  close(): Promise<void>;
}

// No job ids derived from e-mail ids: they would collide with jobs kept in Redis from before a
// database reset. A duplicate job is harmless, since a delivery claims its row first.
export const deliverJobOptions = {
  attempts: 3,
  backoff: { type: 'exponential' as const, delay: 2000 },
  removeOnComplete: true,
  removeOnFail: 1000,
};

export function createMailQueue(redisUrl: string, logger: Logger): MailQueue {
  // enableOfflineQueue false: with Redis down, add() fails at once instead of holding the request.
  const connection = new Redis(redisUrl, { enableOfflineQueue: false, maxRetriesPerRequest: 1, lazyConnect: false });
  connection.on('error', (err) => logger.debug({ err }, 'mail queue: redis error'));
  const queue = new Queue(EMAIL_QUEUE, { connection });
  queue.on('error', (err) => logger.debug({ err }, 'mail queue error'));
  return {
    async notify(emailIds) {
      try {
        await queue.addBulk(
          emailIds.map((emailId) => ({
            name: 'deliver',
            data: { emailId },
            opts: deliverJobOptions,
          })),
        );
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
