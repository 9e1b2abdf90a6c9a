import type { Knex } from 'knex';
import type { ResultSetHeader } from 'mysql2';
import type { ReminderDelivery, ReminderKind, ReminderSubjectType } from '@heatfleet/domain';

type Db = Knex | Knex.Transaction;

export interface NewReminder {
  kind: ReminderKind;
  subjectType: ReminderSubjectType;
  subjectId: number;
  periodKey: string;
  summary: string;
}

/**
 * INSERT IGNORE against the unique (firm, kind, subject, period) key: the id when this call made the
 * row, undefined when the thing was already reminded for that period (by an earlier or a racing scan,
 * which holds the key's lock until it commits).
 */
export async function insertReminderIfNew(
  trx: Knex.Transaction,
  firmId: number,
  reminder: NewReminder,
): Promise<number | undefined> {
  const [result] = (await trx.raw(
    'INSERT IGNORE INTO reminders (firm_id, kind, subject_type, subject_id, period_key, summary) VALUES (?, ?, ?, ?, ?, ?)',
    [
      firmId,
      reminder.kind,
      reminder.subjectType,
      reminder.subjectId,
      reminder.periodKey,
      reminder.summary.slice(0, 300),
    ],
  )) as [ResultSetHeader];
  return result.affectedRows === 1 ? result.insertId : undefined;
}

export async function insertReminderDeliveries(
  trx: Knex.Transaction,
  firmId: number,
  rows: { reminderId: number; emailId: number; recipient: string }[],
): Promise<void> {
  if (rows.length === 0) return;
  await trx('reminder_deliveries').insert(
    rows.map((r) => ({ firm_id: firmId, reminder_id: r.reminderId, email_id: r.emailId, recipient: r.recipient })),
  );
}

/** What was sent, to whom and why, newest first. */
export async function listReminderDeliveries(db: Db, firmId: number, limit: number): Promise<ReminderDelivery[]> {
  const rows = (await db('reminder_deliveries as d')
    .join('reminders as r', function joinReminder() {
      this.on('r.id', '=', 'd.reminder_id').andOn('r.firm_id', '=', 'd.firm_id');
    })
    .leftJoin('emails as e', function joinEmail() {
      this.on('e.id', '=', 'd.email_id').andOn('e.firm_id', '=', 'd.firm_id');
    })
    .where('d.firm_id', firmId)
    .select('d.id', 'r.kind', 'r.subject_type', 'r.subject_id', 'r.summary', 'd.recipient', 'e.sent_at', 'd.created_at')
    .orderBy([
      { column: 'd.created_at', order: 'desc' },
      { column: 'd.id', order: 'desc' },
    ])
    .limit(limit)) as {
    id: number;
    kind: ReminderKind;
    subject_type: ReminderSubjectType;
    subject_id: number;
    summary: string;
    recipient: string;
    sent_at: Date | null;
    created_at: Date;
  }[];
  return rows.map((r) => ({
    id: Number(r.id),
    kind: r.kind,
    subjectType: r.subject_type,
    subjectId: r.subject_id,
    summary: r.summary,
    recipient: r.recipient,
    sentAt: r.sent_at ? new Date(r.sent_at).toISOString() : null,
    createdAt: new Date(r.created_at).toISOString(),
  }));
}
