import type { Knex } from 'knex';
import type { Customer, CustomerInput } from '@heatfleet/domain';

type Db = Knex | Knex.Transaction;

const customerColumns = ['id', 'name', 'email', 'phone', 'contact'];

export async function listCustomerRows(db: Db, firmId: number): Promise<Customer[]> {
  return (await db('customers').where({ firm_id: firmId }).orderBy('name').select(customerColumns)) as Customer[];
}

/**
 * The type-ahead: customers whose name, or one of whose sites' address or postcode, holds the text
 * (a postcode matched with or without its space); names starting with it first, at most `limit`.
 * Wildcards typed by the user are taken literally.
 */
export async function searchCustomerRows(db: Db, firmId: number, text: string, limit: number): Promise<Customer[]> {
  const escape = (s: string) => s.replace(/[\\%_]/g, (c) => `\\${c}`);
  const pattern = `%${escape(text)}%`;
  const compact = `%${escape(text.replace(/\s+/g, ''))}%`;
  const sitesMatching = db('sites as s')
    .where('s.firm_id', firmId)
    .where((w) =>
      w
        .where('s.address', 'like', pattern)
        .orWhere('s.postcode', 'like', pattern)
        .orWhereRaw("REPLACE(s.postcode, ' ', '') LIKE ?", [compact]),
    )
    .select('s.customer_id');
  return (await db('customers as c')
    .where('c.firm_id', firmId)
    .where((w) => w.where('c.name', 'like', pattern).orWhereIn('c.id', sitesMatching))
    .orderByRaw('c.name LIKE ? DESC', [`${escape(text)}%`])
    .orderBy('c.name')
    .limit(limit)
    .select(customerColumns.map((c) => `c.${c}`))) as Customer[];
}

/** The sites of these customers, for the list's answer (one query, not one per customer). */
export async function listSitesOfCustomers(db: Db, firmId: number, customerIds: number[]) {
  if (customerIds.length === 0) return [];
  return (await db('sites')
    .where('firm_id', firmId)
    .whereIn('customer_id', customerIds)
    .orderBy('id')
    .select('id', 'customer_id as customerId', 'address', 'postcode')) as {
    id: number;
    customerId: number;
    address: string;
    postcode: string | null;
  }[];
}

export async function findCustomer(db: Db, firmId: number, customerId: number): Promise<Customer | undefined> {
  return (await db('customers').where({ firm_id: firmId, id: customerId }).first(customerColumns)) as
    Customer | undefined;
}

export async function insertCustomer(db: Db, firmId: number, input: CustomerInput): Promise<number> {
  const [id] = await db('customers').insert({
    firm_id: firmId,
    name: input.name,
    email: input.email ?? null,
    phone: input.phone ?? null,
    contact: input.contact ?? null,
  });
  return id as number;
}
