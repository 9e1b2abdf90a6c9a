import { ForbiddenError } from '@casl/ability';
import type { Customer, CustomerDetail, CustomerInput } from '@heatfleet/domain';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { notFound } from '../../lib/http-error.ts';
import { listSitesOfCustomer } from '../sites/site-dal.ts';
import { findCustomer, insertCustomer, listCustomerRows } from './customer-dal.ts';

export async function listCustomers(deps: AppDeps, actor: Actor): Promise<Customer[]> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Customer');
  return listCustomerRows(deps.db, actor.firmId);
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
