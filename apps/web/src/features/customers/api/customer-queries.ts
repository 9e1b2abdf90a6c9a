import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import { customerPageResponseSchema } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';

export interface CustomerPageFilters {
  q?: string | undefined;
  page: number;
  pageSize: number;
}

/** One page of customers, searched by the server (name, address or postcode). */
export function getCustomerPage(filters: CustomerPageFilters) {
  const params = new URLSearchParams({ page: String(filters.page), pageSize: String(filters.pageSize) });
  if (filters.q) params.set('q', filters.q);
  return apiClient.get(`/api/customers?${params.toString()}`, customerPageResponseSchema);
}

export const customerQueries = {
  all: () => ['customers'] as const,
  pages: () => [...customerQueries.all(), 'page'] as const,
  page: (filters: CustomerPageFilters) =>
    queryOptions({
      queryKey: [...customerQueries.pages(), filters] as const,
      queryFn: () => getCustomerPage(filters),
      // The previous page stays on screen while the next one loads, so the list does not jump.
      placeholderData: keepPreviousData,
    }),
};
