import type { Knex } from 'knex';
import { createHash } from 'node:crypto';

export interface SeededMoney {
  priceItemId: number;
  invoiceId: number;
  creditNoteId: number;
  quoteId: number;
  /** The seeded quote's link token (sent, valid until 2030). */
  quoteToken: string;
}

/**
 * Money records for a seeded firm (modules/money): a price, an issued invoice of £100 + VAT (on no job, so the
 * seeded job's completion still makes its own) with a credit note for half of it, and a sent quote on the seeded job. The firm's money settings are not
 * saved, so completing a job in other tests makes no invoice; the sequences start after these records.
 */
export async function seedMoney(
  trx: Knex.Transaction,
  f: {
    firmId: number;
    firmName: string;
    siteId: number;
    customerId: number;
    customerName: string;
    jobId: number;
    userId: number;
  },
): Promise<SeededMoney> {
  const { firmId } = f;
  const [priceItemId] = (await trx('price_items').insert({
    firm_id: firmId,
    kind: 'visit',
    name: 'Seeded full clean',
    visit_kind: 'full_clean',
    pricing: 'per_radiator',
    base_pence: 10_000,
    per_radiator_pence: 1_000,
  })) as number[];
  await trx('money_sequences').insert([
    { firm_id: firmId, kind: 'invoice', last_number: 1 },
    { firm_id: firmId, kind: 'credit_note', last_number: 1 },
    { firm_id: firmId, kind: 'quote', last_number: 1 },
  ]);
  const [invoiceId] = (await trx('invoices').insert({
    firm_id: firmId,
    job_id: null,
    customer_id: f.customerId,
    number: 1,
    status: 'issued',
    supplied_at: new Date('2026-11-10T12:00:00Z'),
    issued_at: new Date('2026-11-10T12:00:00Z'),
    issued_on: '2026-11-10',
    due_on: '2026-11-24',
    firm_name: f.firmName,
    firm_address: null,
    vat_number: 'GB999999973',
    vat_registered: true,
    customer_name: f.customerName,
    customer_address: 'Seeded address',
    customer_email: null,
    net_pence: 10_000,
    vat_pence: 2_000,
    total_pence: 12_000,
    credited_pence: 6_000,
  })) as number[];
  const line = { firm_id: firmId, kind: 'visit', description: 'Seeded visit', unit_pence: 5_000, vat_rate_bp: 2000 };
  const [invoiceLineId] = (await trx('invoice_lines').insert({
    ...line,
    invoice_id: invoiceId,
    position: 1,
    quantity: 2,
    net_pence: 10_000,
    vat_pence: 2_000,
  })) as number[];
  const [creditNoteId] = (await trx('credit_notes').insert({
    firm_id: firmId,
    invoice_id: invoiceId,
    number: 1,
    reason: 'Seeded credit',
    issued_at: new Date('2026-11-12T12:00:00Z'),
    net_pence: 5_000,
    vat_pence: 1_000,
    total_pence: 6_000,
  })) as number[];
  await trx('credit_note_lines').insert({
    ...line,
    credit_note_id: creditNoteId,
    invoice_line_id: invoiceLineId,
    position: 1,
    quantity: 1,
    net_pence: 5_000,
    vat_pence: 1_000,
  });
  const quoteToken = createHash('sha256').update(`seeded-quote-${firmId}`).digest('base64url');
  const [quoteId] = (await trx('quotes').insert({
    firm_id: firmId,
    job_id: f.jobId,
    number: 1,
    status: 'sent',
    valid_until: '2030-01-31',
    vat_registered: true,
    net_pence: 5_000,
    vat_pence: 1_000,
    total_pence: 6_000,
    token_hash: createHash('sha256').update(quoteToken).digest('hex'),
    token_expires_at: new Date('2030-02-02T00:00:00Z'),
    sent_at: new Date('2026-11-01T12:00:00Z'),
    created_by_user_id: f.userId,
  })) as number[];
  await trx('quote_lines').insert({
    ...line,
    quote_id: quoteId,
    position: 1,
    quantity: 1,
    net_pence: 5_000,
    vat_pence: 1_000,
  });
  return {
    priceItemId: priceItemId!,
    invoiceId: invoiceId!,
    creditNoteId: creditNoteId!,
    quoteId: quoteId!,
    quoteToken,
  };
}
