import { queryOptions } from '@tanstack/react-query';
import {
  customerListResponseSchema,
  siteDetailSchema,
  siteListResponseSchema,
  vanListResponseSchema,
} from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { queryRoots } from '@/lib/query-keys';

// The answers' shapes are the domain's, the same schemas the API declares for these routes.

export function getSite(id: number) {
  return apiClient.get(`/api/sites/${id}`, siteDetailSchema);
}

export async function listSites() {
  return (await apiClient.get('/api/sites', siteListResponseSchema)).sites;
}

export async function listCustomers() {
  return (await apiClient.get('/api/customers', customerListResponseSchema)).customers;
}

/** The firm's vans, for the van a check visit's top-up comes off. */
export async function listVansForTopUp() {
  return (await apiClient.get('/api/vans', vanListResponseSchema)).vans;
}

export const siteQueries = {
  all: () => ['sites'] as const,
  lists: () => [...siteQueries.all(), 'list'] as const,
  list: () => queryOptions({ queryKey: siteQueries.lists(), queryFn: listSites }),
  details: () => [...siteQueries.all(), 'detail'] as const,
  detail: (id: number) =>
    queryOptions({ queryKey: [...siteQueries.details(), id] as const, queryFn: () => getSite(id) }),
  customers: () => queryOptions({ queryKey: [...siteQueries.all(), 'customers'] as const, queryFn: listCustomers }),
  // Under the vans root, so a change to the vans (lib/query-keys.ts) refreshes this list too.
  topUpVans: () =>
    queryOptions({ queryKey: [...queryRoots.vans, 'for-site-checks'] as const, queryFn: listVansForTopUp }),
};
