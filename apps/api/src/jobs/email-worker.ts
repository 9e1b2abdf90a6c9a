import { Queue, Worker } from 'bullmq';
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import type { Env } from '../config/env.ts';
import type { Clock } from '../lib/clock.ts';
import { createObjectStore } from '../lib/object-store.ts';
import { connectRedis } from '../lib/redis-connection.ts';
import { createTransport, deliverEmail } from '../modules/mail/email-delivery.ts';
import { listUnsentEmailIds } from '../modules/mail/mail-dal.ts';
import { deliverJob, EMAIL_QUEUE, emailRetryDelayMs } from '../modules/mail/mail-queue.ts';

const SWEEP_EVERY_MS = 60_000;
const SWEEP_GRACE_MS = 30_000;

/**
 * Delivers stored e-mails. Besides the "deliver" jobs the API queues, a repeating sweep re-queues
 * any e-mail still unsent and not already waiting in a job (Redis was down when it was written, or
 * the SMTP server was down for longer than the job's own retries): so an e-mail is never given up on.
 */
export function startEmailWorker(deps: { env: Env; db: Knex; logger: Logger; clock: Clock }) {
  const connection = connectRedis(deps.env, { maxRetriesPerRequest: null });
  connection.on('error', (err) => deps.logger.warn({ err: err.message }, 'worker: redis error'));
  const transport = createTransport(deps.env);
  const objectStore = createObjectStore(deps.env);
  const from = deps.env.MAIL_FROM;
  const queue = new Queue(EMAIL_QUEUE, { connection });

  const worker = new Worker(
    EMAIL_QUEUE,
    async (job) => {
      if (job.name === 'sweep') {
        const olderThan = new Date(deps.clock.now().getTime() - SWEEP_GRACE_MS);
        const ids = await listUnsentEmailIds(deps.db, olderThan);
        await queue.addBulk(ids.map(deliverJob));
        return { requeued: ids.length };
      }
      const { emailId } = job.data as { emailId: number };
      return deliverEmail(deps.db, transport, from, deps.clock, emailId, objectStore);
    },
    { connection, concurrency: 4, settings: { backoffStrategy: emailRetryDelayMs } },
  );
  worker.on('failed', (job, err) => deps.logger.warn({ jobId: job?.id, err: err.message }, 'e-mail job failed'));
  worker.on('error', (err) => deps.logger.warn({ err: err.message }, 'worker error'));
  const scheduled = queue
    .upsertJobScheduler('email-sweep', { every: SWEEP_EVERY_MS }, { name: 'sweep', data: {} })
    .catch((err: unknown) => deps.logger.warn({ err }, 'could not schedule the e-mail sweep'));

  return {
    worker,
    async close() {
      await scheduled;
      await worker.close();
      await queue.close();
      transport.close();
      connection.disconnect();
    },
  };
}
