import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTransport, deliverEmail } from '@heatfleet/api/modules/mail/email-delivery.ts';
import { createTestApp, uniqueEmail, type TestApp } from './support/test-app.ts';
import { findEmails, waitForEmail } from './support/outbox.ts';

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

async function storeEmail(to: string): Promise<number> {
  const [id] = (await t.deps.db('emails').insert({
    firm_id: null,
    to_address: to,
    subject: 'Delivery test',
    text_body: 'Hello',
    purpose: 'reminder',
  })) as number[];
  return id!;
}

describe('e-mail delivery', () => {
  it('sends a stored e-mail once, even when two deliveries of it race', async () => {
    const to = uniqueEmail('delivery');
    const id = await storeEmail(to);
    const transport = createTransport(t.deps.env);
    try {
      const results = await Promise.all(
        [1, 2, 3].map(() => deliverEmail(t.deps.db, transport, t.deps.env.MAIL_FROM, t.clock, id)),
      );
      expect(results.filter((r) => r === 'sent')).toHaveLength(1);
      await waitForEmail(to);
      expect(await deliverEmail(t.deps.db, transport, t.deps.env.MAIL_FROM, t.clock, id)).toBe('skipped');
      await new Promise((r) => setTimeout(r, 300));
      expect(await findEmails(to)).toHaveLength(1);
      const row = await t.deps.db('emails').where({ id }).first();
      expect(row.sent_at).not.toBeNull();
    } finally {
      transport.close();
    }
  });

  it('records a failed attempt and leaves the e-mail unsent for a retry', async () => {
    const to = uniqueEmail('delivery-fail');
    const id = await storeEmail(to);
    const deadTransport = createTransport({ ...t.deps.env, SMTP_PORT: 1 });
    try {
      await expect(deliverEmail(t.deps.db, deadTransport, t.deps.env.MAIL_FROM, t.clock, id)).rejects.toThrow();
      const row = await t.deps.db('emails').where({ id }).first();
      expect(row.sent_at).toBeNull();
      expect(row.attempts).toBe(1);
      expect(row.last_error).toBeTruthy();
      const transport = createTransport(t.deps.env);
      expect(await deliverEmail(t.deps.db, transport, t.deps.env.MAIL_FROM, t.clock, id)).toBe('sent');
      transport.close();
    } finally {
      deadTransport.close();
    }
  });
});
