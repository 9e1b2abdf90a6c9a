import type { Knex } from 'knex';

type Db = Knex | Knex.Transaction;

export interface PaymentAccountRow {
  id: number;
  firm_id: number;
  provider_account_id: string;
  charges_enabled: number | boolean;
  details_submitted: number | boolean;
}

export async function findPaymentAccount(db: Db, firmId: number): Promise<PaymentAccountRow | undefined> {
  return (await db('payment_accounts').where({ firm_id: firmId }).first()) as PaymentAccountRow | undefined;
}

/** The firm whose connected account this is (webhooks name the account, not the firm). */
export async function findPaymentAccountByProviderId(
  db: Db,
  accountId: string,
): Promise<PaymentAccountRow | undefined> {
  return (await db('payment_accounts').where({ provider_account_id: accountId }).first()) as
    PaymentAccountRow | undefined;
}

export async function insertPaymentAccount(db: Db, firmId: number, accountId: string): Promise<void> {
  await db('payment_accounts').insert({ firm_id: firmId, provider_account_id: accountId });
}

/** The service no longer knows the account: forgotten, so the Owner can connect again (payments keep their rows). */
export async function deletePaymentAccount(db: Db, firmId: number): Promise<void> {
  await db('payment_accounts').where({ firm_id: firmId }).delete();
}

export async function setPaymentAccountStatus(
  db: Db,
  firmId: number,
  status: { chargesEnabled: boolean; detailsSubmitted: boolean },
  now: Date,
): Promise<void> {
  await db('payment_accounts').where({ firm_id: firmId }).update({
    charges_enabled: status.chargesEnabled,
    details_submitted: status.detailsSubmitted,
    updated_at: now,
  });
}

export interface PaymentRow {
  id: number;
  firm_id: number;
  invoice_id: number;
  reference: string;
  checkout_session_id: string;
  payment_intent_id: string | null;
  amount_pence: number;
  refunded_pence: number;
  status: 'pending' | 'succeeded' | 'failed' | 'expired';
  failure_message: string | null;
  started_from: 'email_link' | 'doorstep';
  paid_at: Date | null;
  created_at: Date;
}

export async function insertPayment(
  db: Db,
  row: Pick<
    PaymentRow,
    'firm_id' | 'invoice_id' | 'reference' | 'checkout_session_id' | 'amount_pence' | 'started_from' | 'status'
  > & { payment_intent_id?: string | null },
): Promise<number> {
  const [id] = await db('payments').insert(row);
  return id as number;
}

export async function findPayment(
  db: Db,
  firmId: number,
  id: number,
  opts: { forUpdate?: boolean } = {},
): Promise<PaymentRow | undefined> {
  const q = db('payments').where({ firm_id: firmId, id }).first();
  return (await (opts.forUpdate ? q.forUpdate() : q)) as PaymentRow | undefined;
}

/** The payment an event is about, by our reference or the service's payment intent, locked for the change. */
export async function findPaymentForEvent(
  trx: Knex.Transaction,
  firmId: number,
  ref: { reference?: string; paymentIntentId?: string; checkoutSessionId?: string },
): Promise<PaymentRow | undefined> {
  const q = trx('payments').where({ firm_id: firmId });
  q.andWhere((w) => {
    if (ref.reference) w.orWhere({ reference: ref.reference });
    if (ref.paymentIntentId) w.orWhere({ payment_intent_id: ref.paymentIntentId });
    if (ref.checkoutSessionId) w.orWhere({ checkout_session_id: ref.checkoutSessionId });
    if (!ref.reference && !ref.paymentIntentId && !ref.checkoutSessionId) w.whereRaw('1 = 0');
  });
  return (await q.first().forUpdate()) as PaymentRow | undefined;
}

export async function updatePayment(
  trx: Knex.Transaction,
  firmId: number,
  id: number,
  fields: Partial<
    Pick<PaymentRow, 'status' | 'payment_intent_id' | 'failure_message' | 'paid_at' | 'refunded_pence' | 'amount_pence'>
  >,
  now: Date,
): Promise<void> {
  await trx('payments')
    .where({ firm_id: firmId, id })
    .update({ ...fields, updated_at: now });
}

export async function listInvoicePayments(db: Db, firmId: number, invoiceId: number): Promise<PaymentRow[]> {
  return (await db('payments')
    .where({ firm_id: firmId, invoice_id: invoiceId })
    .orderBy('id', 'desc')
    .limit(100)) as PaymentRow[];
}

export interface RefundRow {
  id: number;
  payment_id: number;
  amount_pence: number;
  reason: string | null;
  created_at: Date;
}

export async function listRefunds(db: Db, firmId: number, paymentIds: number[]): Promise<RefundRow[]> {
  if (paymentIds.length === 0) return [];
  return (await db('payment_refunds')
    .where({ firm_id: firmId })
    .whereIn('payment_id', paymentIds)
    .orderBy('id')
    .select('id', 'payment_id', 'amount_pence', 'reason', 'created_at')) as RefundRow[];
}

/** A refund as the service recorded it; a repeat of the same refund id is ignored. */
export async function insertRefundOnce(
  db: Db,
  row: {
    firm_id: number;
    payment_id: number;
    provider_refund_id: string;
    amount_pence: number;
    reason: string | null;
    created_by_user_id: number | null;
  },
): Promise<void> {
  await db('payment_refunds').insert(row).onConflict('provider_refund_id').ignore();
}

/** Marks an event applied; false when it was applied before (the caller then changes nothing). */
export async function insertEventOnce(
  trx: Knex.Transaction,
  row: { firm_id: number; event_id: string; type: string; received_at: Date },
): Promise<boolean> {
  const inserted = (await trx('payment_events').insert(row).onConflict('event_id').ignore()) as unknown as number[];
  // MariaDB answers the new id, or 0 when the row was ignored.
  return Array.isArray(inserted) && Number(inserted[0]) > 0;
}

export async function eventSeen(db: Db, eventId: string): Promise<boolean> {
  return (await db('payment_events').where({ event_id: eventId }).first('id')) !== undefined;
}
