import { Queue } from 'bullmq';
import { Redis } from 'ioredis';
import type { Logger } from 'pino';

export const EMAIL_QUEUE = 'email';

export interface MailQueue {
  /** Asks the worker to deliver stored e-mails now; if Redis is down the sweep delivers them later. */
  notify(emailIds: number[]): Promise<void>;
  close(): Promise<void>;
}

export function emailJobId(emailId: number): string {
  return `email-${emailId}`;
}

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
            opts: {
              jobId: emailJobId(emailId),
              attempts: 10,
              backoff: { type: 'exponential', delay: 5000 },
              removeOnComplete: 1000,
              removeOnFail: 5000,
            },
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
