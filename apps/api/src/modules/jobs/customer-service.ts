import { ForbiddenError } from '@casl/ability';
import {
  CUSTOMER_SEARCH_LIMIT,
  type Customer,
  type CustomerDetail,
  type CustomerInput,
  type CustomerListQuery,
} from '@heatfleet/domain';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { notFound } from '../../lib/http-error.ts';
import { listSitesOfCustomer } from '../sites/site-dal.ts';
import {
  findCustomer,
  insertCustomer,
  listCustomerRows,
  listSitesOfCustomers,
  searchCustomerRows,
} from './customer-dal.ts';

type CustomerWithSites = Customer & { sites: { id: number; address: string; postcode: string | null }[] };

/** Every customer, or with `q` the type-ahead's best 10; each with their sites, so a booking can follow the match. */
export async function listCustomers(
  deps: AppDeps,
  actor: Actor,
  query: CustomerListQuery = {},
): Promise<CustomerWithSites[]> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Customer');
  const customers = query.q
    ? await searchCustomerRows(deps.db, actor.firmId, query.q, CUSTOMER_SEARCH_LIMIT)
    : await listCustomerRows(deps.db, actor.firmId);
  const sites = await listSitesOfCustomers(
    deps.db,
    actor.firmId,
    customers.map((c) => c.id),
  );
  return customers.map((c) => ({
    ...c,
    sites: sites.filter((s) => s.customerId === c.id).map(({ id, address, postcode }) => ({ id, address, postcode })),
  }));
}

export async function getCustomer(deps: AppDeps, actor: Actor, id: number): Promise<CustomerDetail> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Customer');
  const customer = await findCustomer(deps.db, actor.firmId, id);
  if (!customer) throw notFound('That customer');
  return { ...customer, sites: await listSitesOfCustomer(deps.db, actor.firmId, id) };
}

/** A new customer; the answer is the customer as read back, with no sites yet. */
export async function createCustomer(deps: AppDeps, actor: Actor, input: CustomerInput): Promise<CustomerDetail> {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Customer');
  const id = await insertCustomer(deps.db, actor.firmId, input);
  return getCustomer(deps, actor, id);
}
