import type { Knex } from 'knex';
import { UK_STANDARD_VAT_RATE_BP } from '@heatfleet/domain';

type Db = Knex | Knex.Transaction;

export interface MoneySettingsRow {
  /** False when the firm has never saved money settings: then nothing is invoiced at completion. */
  saved: boolean;
  vatRegistered: boolean;
  vatNumber: string | null;
  vatRateBp: number;
  paymentTermsDays: number;
  quoteValidityDays: number;
  firstReminderDays: number;
  secondReminderDays: number;
  invoiceOnCompletion: boolean;
}

export const DEFAULT_MONEY_SETTINGS: MoneySettingsRow = {
  saved: false,
  vatRegistered: false,
  vatNumber: null,
  vatRateBp: UK_STANDARD_VAT_RATE_BP,
  paymentTermsDays: 14,
  quoteValidityDays: 30,
  firstReminderDays: 7,
  secondReminderDays: 21,
  invoiceOnCompletion: true,
};

export async function findMoneySettings(db: Db, firmId: number): Promise<MoneySettingsRow> {
  const r = (await db('money_settings').where({ firm_id: firmId }).first()) as Record<string, unknown> | undefined;
  if (!r) return DEFAULT_MONEY_SETTINGS;
  return {
    saved: true,
    vatRegistered: Boolean(r.vat_registered),
    vatNumber: (r.vat_number as string | null) ?? null,
    vatRateBp: Number(r.vat_rate_bp),
    paymentTermsDays: Number(r.payment_terms_days),
    quoteValidityDays: Number(r.quote_validity_days),
    firstReminderDays: Number(r.first_reminder_days),
    secondReminderDays: Number(r.second_reminder_days),
    invoiceOnCompletion: Boolean(r.invoice_on_completion),
  };
}

export async function saveMoneySettings(db: Db, firmId: number, s: Omit<MoneySettingsRow, 'saved'>): Promise<void> {
  const row = {
    vat_registered: s.vatRegistered,
    vat_number: s.vatRegistered ? s.vatNumber : null,
    vat_rate_bp: s.vatRateBp,
    payment_terms_days: s.paymentTermsDays,
    quote_validity_days: s.quoteValidityDays,
    first_reminder_days: s.firstReminderDays,
    second_reminder_days: s.secondReminderDays,
    invoice_on_completion: s.invoiceOnCompletion,
    updated_at: new Date(),
  };
  await db('money_settings')
    .insert({ firm_id: firmId, ...row })
    .onConflict('firm_id')
    .merge(Object.keys(row));
}

export type SequenceKind = 'invoice' | 'credit_note' | 'quote';

/**
 * The next number of a firm's sequence, taken in the caller's transaction: one statement inserts the
 * counter at 1 or adds 1 under the row's lock, which holds until commit, so concurrent issues queue
 * and a rolled-back one gives its number back (no gap, no repeat).
 */
export async function takeNextNumber(trx: Knex.Transaction, firmId: number, kind: SequenceKind): Promise<number> {
  await trx.raw(
    'INSERT INTO money_sequences (firm_id, kind, last_number) VALUES (?, ?, 1) ON DUPLICATE KEY UPDATE last_number = last_number + 1',
    [firmId, kind],
  );
  const row = (await trx('money_sequences').where({ firm_id: firmId, kind }).first('last_number')) as {
    last_number: number;
  };
  return Number(row.last_number);
}
