import type { Knex } from 'knex';
import type { Customer } from '@heatfleet/domain';

type Db = Knex | Knex.Transaction;

const escapeLike = (s: string) => s.replace(/[\\%_]/g, (c) => `\\${c}`);

/**
 * The customers whose name, or one of whose sites' address or postcode, holds the text (a postcode matched with
 * or without its space); wildcards typed by the user are taken literally.
 */
function matching(db: Db, firmId: number, text: string | undefined) {
  const query = db('customers as c').where('c.firm_id', firmId);
  if (!text) return query;
  const pattern = `%${escapeLike(text)}%`;
  const compact = `%${escapeLike(text.replace(/\s+/g, ''))}%`;
  const sitesMatching = db('sites as s')
    .where('s.firm_id', firmId)
    .where((w) =>
      w
        .where('s.address', 'like', pattern)
        .orWhere('s.postcode', 'like', pattern)
        .orWhereRaw("REPLACE(s.postcode, ' ', '') LIKE ?", [compact]),
    )
    .select('s.customer_id');
  return query.where((w) => w.where('c.name', 'like', pattern).orWhereIn('c.id', sitesMatching));
}

/** One page of customers by name (a search: names starting with the text first) and how many match in all. */
export async function pageCustomerRows(
  db: Db,
  firmId: number,
  options: { text?: string; offset: number; limit: number },
): Promise<{ rows: Customer[]; total: number }> {
  const rowsQuery = matching(db, firmId, options.text);
  if (options.text) rowsQuery.orderByRaw('c.name LIKE ? DESC', [`${escapeLike(options.text)}%`]);
  const [rows, counted] = await Promise.all([
    rowsQuery
      .orderBy('c.name')
      .orderBy('c.id')
      .offset(options.offset)
      .limit(options.limit)
      .select('c.id', 'c.name', 'c.email', 'c.phone', 'c.contact'),
    matching(db, firmId, options.text).count({ n: '*' }).first(),
  ]);
  return { rows: rows as Customer[], total: Number((counted as { n: number | string } | undefined)?.n ?? 0) };
}

/** The sites of these customers with their next annual check (one query, not one per customer). */
export async function listSitesOfCustomerPage(db: Db, firmId: number, customerIds: number[]) {
  if (customerIds.length === 0) return [];
  return (await db('sites')
    .where('firm_id', firmId)
    .whereIn('customer_id', customerIds)
    .orderBy('id')
    .select('id', 'customer_id as customerId', 'address', 'postcode', 'next_check_on as nextCheckOn')) as {
    id: number;
    customerId: number;
    address: string;
    postcode: string | null;
    nextCheckOn: string | null;
  }[];
}
