import { ForbiddenError } from '@casl/ability';
import {
  CUSTOMER_PAGE_SIZE,
  CUSTOMER_TYPE_AHEAD_SIZE,
  type CustomerPageQuery,
  type CustomerPageResponse,
} from '@heatfleet/domain';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { listSitesOfCustomerPage, pageCustomerRows } from './customers-list-dal.ts';

/**
 * One page of the firm's customers, each with their sites; with `q`, those whose name, address or postcode holds
 * the text, names starting with it first. Without a page size a search is the booking's type-ahead (its best 10).
 */
export async function listCustomerPage(
  deps: AppDeps,
  actor: Actor,
  query: CustomerPageQuery,
): Promise<CustomerPageResponse> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Customer');
  const pageSize = query.pageSize ?? (query.q ? CUSTOMER_TYPE_AHEAD_SIZE : CUSTOMER_PAGE_SIZE);
  const { rows, total } = await pageCustomerRows(deps.db, actor.firmId, {
    text: query.q,
    offset: (query.page - 1) * pageSize,
    limit: pageSize,
  });
  const sites = await listSitesOfCustomerPage(
    deps.db,
    actor.firmId,
    rows.map((c) => c.id),
  );
  return {
    customers: rows.map((c) => ({
      ...c,
      sites: sites
        .filter((s) => s.customerId === c.id)
        .map(({ id, address, postcode, nextCheckOn }) => ({ id, address, postcode, nextCheckOn })),
    })),
    total,
    page: query.page,
    pageSize,
  };
}
