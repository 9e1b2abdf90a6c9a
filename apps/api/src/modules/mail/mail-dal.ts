import type { Knex } from 'knex';

export interface NewEmail {
  firmId: number | null;
  to: string;
  subject: string;
  text: string;
  html: string | null;
  purpose: 'invitation' | 'password-reset' | 'sign-up' | 'reminder' | 'job-report' | 'site-check' | 'invoice' | 'quote';
  /** A file in object storage to attach, e.g. a completion report. */
  attachment?: { key: string; filename: string };
}

export interface EmailRow {
  id: number;
  firm_id: number | null;
  to_address: string;
  subject: string;
  text_body: string;
  html_body: string | null;
  attempts: number;
  sent_at: Date | null;
  attachment_key: string | null;
  attachment_name: string | null;
}

/** Written inside the caller's transaction: the e-mail exists exactly when the change it reports does. */
export async function insertEmail(trx: Knex.Transaction, email: NewEmail): Promise<number> {
  const [id] = await trx('emails').insert({
    firm_id: email.firmId,
    to_address: email.to,
    subject: email.subject,
    text_body: email.text,
    html_body: email.html,
    purpose: email.purpose,
    attachment_key: email.attachment?.key ?? null,
    attachment_name: email.attachment?.filename ?? null,
  });
  return id as number;
}

/** Takes an unsent e-mail for one delivery attempt; undefined if it is sent or another worker holds it. */
export async function claimUnsentEmail(
  db: Knex,
  id: number,
  now: Date,
  leaseMs: number,
): Promise<EmailRow | undefined> {
  const claimed = await db('emails')
    .where({ id })
    .whereNull('sent_at')
    .andWhere((q) => q.whereNull('claimed_until').orWhere('claimed_until', '<', now))
    .update({ claimed_until: new Date(now.getTime() + leaseMs) });
  if (claimed !== 1) return undefined;
  return db<EmailRow>('emails').where({ id }).first();
}

export async function markEmailSent(db: Knex, id: number, at: Date): Promise<void> {
  await db('emails').where({ id }).update({ sent_at: at, last_error: null, claimed_until: null });
}

export async function recordEmailFailure(db: Knex, id: number, error: string): Promise<void> {
  await db('emails')
    .where({ id })
    .increment('attempts', 1)
    .update({ last_error: error.slice(0, 500), claimed_until: null });
}

export async function listUnsentEmailIds(db: Knex, olderThan: Date, limit = 200): Promise<number[]> {
  const rows: { id: number }[] = await db('emails')
    .whereNull('sent_at')
    .where('created_at', '<', olderThan)
    .andWhere((q) => q.whereNull('claimed_until').orWhere('claimed_until', '<', new Date()))
    .orderBy('id')
    .limit(limit)
    .select('id');
  return rows.map((r) => r.id);
}
