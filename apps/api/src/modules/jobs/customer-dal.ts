import type { Knex } from 'knex';
import type { Customer, CustomerInput } from '@heatfleet/domain';

type Db = Knex | Knex.Transaction;

const customerColumns = ['id', 'name', 'email', 'phone', 'contact'];

export async function listCustomerRows(db: Db, firmId: number): Promise<Customer[]> {
  return (await db('customers').where({ firm_id: firmId }).orderBy('name').select(customerColumns)) as Customer[];
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
