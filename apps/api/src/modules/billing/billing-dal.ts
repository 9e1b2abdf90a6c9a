import type { Knex } from 'knex';

type Db = Knex | Knex.Transaction;

export interface SubscriptionRow {
  id: number;
  firm_id: number;
  customer_id: string;
  subscription_id: string;
  item_id: string;
  status: string;
  quantity: number;
  unit_amount_pence: number;
  trial_ends_at: Date | null;
  period_ends_at: Date | null;
  payment_failed_at: Date | null;
}

export async function findSubscription(db: Db, firmId: number): Promise<SubscriptionRow | undefined> {
  return (await db('firm_subscriptions').where({ firm_id: firmId }).first()) as SubscriptionRow | undefined;
}

export async function findSubscriptionByCustomer(db: Db, customerId: string): Promise<SubscriptionRow | undefined> {
  return (await db('firm_subscriptions').where({ customer_id: customerId }).first()) as SubscriptionRow | undefined;
}

/** Only the column the read-only guard needs, on every write: one row by its unique firm_id. */
export async function findPaymentFailedAt(db: Db, firmId: number): Promise<Date | null> {
  const row = (await db('firm_subscriptions').where({ firm_id: firmId }).first('payment_failed_at')) as
    { payment_failed_at: Date | null } | undefined;
  return row?.payment_failed_at ?? null;
}

export async function insertSubscriptionOnce(
  db: Db,
  row: Omit<SubscriptionRow, 'id' | 'payment_failed_at'>,
): Promise<void> {
  await db('firm_subscriptions').insert(row).onConflict('firm_id').ignore();
}

export async function updateSubscription(
  db: Db,
  firmId: number,
  fields: Partial<
    Pick<SubscriptionRow, 'status' | 'quantity' | 'trial_ends_at' | 'period_ends_at' | 'payment_failed_at'>
  >,
  now: Date,
): Promise<void> {
  await db('firm_subscriptions')
    .where({ firm_id: firmId })
    .update({ ...fields, updated_at: now });
}

/** The first failed payment of an unpaid run is kept; a later failure does not move the grace period on. */
export async function markPaymentFailed(db: Db, firmId: number, at: Date): Promise<void> {
  await db('firm_subscriptions')
    .where({ firm_id: firmId })
    .update({ status: 'past_due', payment_failed_at: db.raw('COALESCE(payment_failed_at, ?)', [at]), updated_at: at });
}

export async function countActiveVans(db: Db, firmId: number): Promise<number> {
  const row = (await db('locations')
    .where({ firm_id: firmId, kind: 'van', active: true })
    .count({ n: '*' })
    .first()) as { n: number | string } | undefined;
  return Number(row?.n ?? 0);
}

export async function firmForBilling(db: Db, firmId: number): Promise<{ name: string; created_at: Date } | undefined> {
  return (await db('firms').where({ id: firmId }).first('name', 'created_at')) as
    { name: string; created_at: Date } | undefined;
}

export async function activeOwnerEmails(db: Db, firmId: number): Promise<string[]> {
  const rows = (await db('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where({ 'm.firm_id': firmId, 'm.role': 'owner', 'm.active': true })
    .select('u.email')) as { email: string }[];
  return rows.map((r) => r.email);
}
