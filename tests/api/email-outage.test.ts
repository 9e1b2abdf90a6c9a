import { Queue } from 'bullmq';
import { Redis } from 'ioredis';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startEmailWorker } from '@heatfleet/api/jobs/email-worker.ts';
import { EMAIL_QUEUE, EMAIL_RETRY, emailRetryDelayMs } from '@heatfleet/api/modules/mail/mail-queue.ts';
import { createTestApp, uniqueEmail, type TestApp } from './support/test-app.ts';

// A Redis database of this file's own: another file's worker, with a working SMTP server, must not pick
// these jobs up. Port 1 refuses at once, standing in for an SMTP server that is down.
const redisUrl = `${process.env.REDIS_URL ?? 'redis://127.0.0.1:6480'}/7`;
let t: TestApp;
let queue: Queue;
let connection: Redis;

beforeAll(async () => {
  t = createTestApp({ env: { REDIS_URL: redisUrl, SMTP_PORT: '1' } });
  connection = new Redis(redisUrl, { maxRetriesPerRequest: null });
  queue = new Queue(EMAIL_QUEUE, { connection });
  await queue.obliterate({ force: true });
});
afterAll(async () => {
  await queue.obliterate({ force: true });
  await queue.close();
  connection.disconnect();
  await t.close();
});

function retryScheduleMs(): number[] {
  return Array.from({ length: EMAIL_RETRY.attempts - 1 }, (_, i) => emailRetryDelayMs(i + 1));
}

describe('e-mail retries while the SMTP server is down', () => {
  it('back off from 5 s, doubling, capped at 2 minutes, and reach past a 10-minute outage', () => {
    const delays = retryScheduleMs();
    expect(delays.slice(0, 6)).toEqual([5_000, 10_000, 20_000, 40_000, 80_000, 120_000]);
    expect(Math.max(...delays)).toBe(120_000);
    const total = delays.reduce((sum, d) => sum + d, 0);
    expect(total).toBeGreaterThan(10 * 60_000);
    expect(total).toBe(875_000);
  });

  it('keeps one delivery job per e-mail, waiting out the backoff after a failed send', async () => {
    const [id] = (await t.deps.db('emails').insert({
      firm_id: null,
      to_address: uniqueEmail('smtp-down'),
      subject: 'Outage test',
      text_body: 'Hello',
      purpose: 'reminder',
    })) as number[];
    const worker = startEmailWorker({ env: t.deps.env, db: t.deps.db, logger: t.deps.logger, clock: t.clock });
    try {
      await t.deps.mailQueue.notify([id!]);
      const deadline = Date.now() + 15_000;
      let delayed = await queue.getDelayed();
      while (!delayed.some((j) => j.name === 'deliver') && Date.now() < deadline) {
        await new Promise((r) => setTimeout(r, 100));
        delayed = await queue.getDelayed();
      }
      const job = delayed.find((j) => j.name === 'deliver');
      expect(job?.data).toEqual({ emailId: id });
      expect(job?.attemptsMade).toBe(1);
      // The next try is about 5 s after the failure, not BullMQ's default of at once.
      const score = await connection.zscore(`bull:${EMAIL_QUEUE}:delayed`, job!.id!);
      const dueAt = Math.floor(Number(score) / 0x1000);
      expect(dueAt - (job!.finishedOn ?? job!.processedOn ?? Date.now())).toBeGreaterThan(4_000);

      // A second notify (or the sweep) while it waits adds no second job.
      await t.deps.mailQueue.notify([id!]);
      const jobs = await queue.getJobs(['waiting', 'delayed', 'active']);
      expect(jobs.filter((j) => j.name === 'deliver' && (j.data as { emailId: number }).emailId === id)).toHaveLength(
        1,
      );

      const row = await t.deps.db('emails').where({ id }).first();
      expect(row.attempts).toBe(1);
      expect(row.sent_at).toBeNull();
      expect(row.last_error).toBeTruthy();
    } finally {
      await worker.close();
      await t.deps.db('emails').where({ id }).delete();
    }
  }, 30_000);
});
