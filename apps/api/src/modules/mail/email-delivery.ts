import type { Knex } from 'knex';
import nodemailer, { type Transporter } from 'nodemailer';
import type { Env } from '../../config/env.ts';
import type { Clock } from '../../lib/clock.ts';
import type { ObjectStore } from '../../lib/object-store.ts';
import { claimUnsentEmail, markEmailSent, recordEmailFailure } from './mail-dal.ts';

// Longer than any SMTP exchange (the transport gives up after 10 s), so a lease never expires mid-send.
const DELIVERY_LEASE_MS = 60_000;

export function createTransport(env: Env): Transporter {
  return nodemailer.createTransport({
    host: env.SMTP_HOST,
    port: env.SMTP_PORT,
    secure: env.SMTP_SECURE,
    auth: env.SMTP_USER ? { user: env.SMTP_USER, pass: env.SMTP_PASSWORD ?? '' } : undefined,
    // The local catcher speaks plain SMTP; a real relay negotiates TLS itself.
    ignoreTLS: !env.SMTP_SECURE && !env.SMTP_USER,
    connectionTimeout: 10_000,
  });
}

/**
 * Sends one stored e-mail. A row already sent, or held by another delivery, is skipped, so a
 * duplicated or retried job does not send it twice; a failure is recorded and rethrown for the
 * queue's backoff.
 */
export async function deliverEmail(
  db: Knex,
  transport: Transporter,
  from: string,
  clock: Clock,
  emailId: number,
  objectStore?: ObjectStore,
): Promise<'sent' | 'skipped'> {
  const email = await claimUnsentEmail(db, emailId, clock.now(), DELIVERY_LEASE_MS);
  if (!email) return 'skipped';
  try {
    const attachments =
      email.attachment_key && objectStore
        ? [
            {
              filename: email.attachment_name ?? 'attachment.pdf',
              content: await streamToBuffer(await objectStore.get(email.attachment_key)),
              contentType: 'application/pdf',
            },
          ]
        : undefined;
    await transport.sendMail({
      attachments,
      from,
      to: email.to_address,
      subject: email.subject,
      text: email.text_body,
      html: email.html_body ?? undefined,
      headers: { 'X-Heatfleet-Email-Id': String(email.id) },
    });
  } catch (err) {
    await recordEmailFailure(db, emailId, err instanceof Error ? err.message : String(err));
    throw err;
  }
  await markEmailSent(db, emailId, clock.now());
  return 'sent';
}

async function streamToBuffer(stream: AsyncIterable<Uint8Array>): Promise<Buffer> {
  const parts: Buffer[] = [];
  for await (const chunk of stream) parts.push(Buffer.from(chunk));
  return Buffer.concat(parts);
}
