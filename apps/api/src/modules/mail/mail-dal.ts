import type { Knex } from 'knex';

export interface NewEmail {
  firmId: number | null;
  to: string;
  subject: string;
  text: string;
  html: string | null;
  purpose: 'invitation' | 'password-reset' | 'reminder';
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
  });
  return id as number;
}

export function findUnsentEmail(db: Knex, id: number): Promise<EmailRow | undefined> {
  return db<EmailRow>('emails').where({ id }).whereNull('sent_at').first();
}

export async function markEmailSent(db: Knex, id: number, at: Date): Promise<boolean> {
  const changed = await db('emails').where({ id }).whereNull('sent_at').update({ sent_at: at, last_error: null });
  return changed === 1;
}

export async function recordEmailFailure(db: Knex, id: number, error: string): Promise<void> {
  await db('emails').where({ id }).increment('attempts', 1).update({ last_error: error.slice(0, 500) });
}

export async function listUnsentEmailIds(db: Knex, olderThan: Date, limit = 200): Promise<number[]> {
  const rows: { id: number }[] = await db('emails').whereNull('sent_at').where('created_at', '<', olderThan).orderBy('id').limit(limit).select('id');
  return rows.map((r) => r.id);
}
