import { infiniteQueryOptions, queryOptions } from '@tanstack/react-query';
import {
  batchStockResponseSchema,
  bookedJobsShortSchema,
  ledgerPageSchema,
  myVanStockSchema,
  parLevelListResponseSchema,
  productListResponseSchema,
  productResponseSchema,
  restockRunSchema,
  stockGridSchema,
  type movementKinds,
} from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { queryRoots } from '@/lib/query-keys';

// Each answer is parsed with the domain's schema, the one the API declares for that route.

export interface LedgerFilters {
  locationId?: number | undefined;
  productId?: number | undefined;
  kind?: (typeof movementKinds)[number] | undefined;
  from?: string | undefined;
  to?: string | undefined;
}

function searchOf(values: Record<string, string | number | undefined>): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(values))
    if (value !== undefined && value !== '') params.set(key, String(value));
  const text = params.toString();
  return text ? `?${text}` : '';
}

/** A plain link: the browser downloads it with the session cookie, so a big export never sits in memory here. */
export function ledgerCsvHref(filters: LedgerFilters): string {
  return `/api/stock/movements.csv${searchOf({ ...filters })}`;
}

export const reorderCsvHref = '/api/stock/reorder-list.csv';

export const LEDGER_PAGE_SIZE = 50;

export const productQueries = {
  all: () => ['products'] as const,
  lists: () => [...productQueries.all(), 'list'] as const,
  list: () =>
    queryOptions({
      queryKey: productQueries.lists(),
      queryFn: async () => (await apiClient.get('/api/products', productListResponseSchema)).products,
    }),
  detail: (id: number) =>
    queryOptions({
      queryKey: [...productQueries.all(), 'detail', id] as const,
      queryFn: async () => (await apiClient.get(`/api/products/${id}`, productResponseSchema)).product,
    }),
};

export const stockQueries = {
  all: () => queryRoots.stock,
  /**
   * A page of the grid (places across, 20 a page). The first page keeps the key ['stock', 'grid'] it had
   * before paging, so a phone's saved copy still answers the stock forms (they take every place from it).
   */
  grid: (page = 1) =>
    queryOptions({
      queryKey:
        page === 1 ? ([...stockQueries.all(), 'grid'] as const) : ([...stockQueries.all(), 'grid', page] as const),
      queryFn: () => apiClient.get(`/api/stock${page === 1 ? '' : searchOf({ page })}`, stockGridSchema),
    }),
  batches: (where: { locationId?: number; productId?: number }) =>
    queryOptions({
      queryKey: [...stockQueries.all(), 'batches', where] as const,
      queryFn: async () =>
        (await apiClient.get(`/api/stock/batches${searchOf(where)}`, batchStockResponseSchema)).batches,
    }),
  ledgers: () => [...stockQueries.all(), 'ledger'] as const,
  ledger: (filters: LedgerFilters) =>
    infiniteQueryOptions({
      queryKey: [...stockQueries.ledgers(), filters] as const,
      queryFn: ({ pageParam }) =>
        apiClient.get(
          `/api/stock/movements${searchOf({ ...filters, before: pageParam ?? undefined, limit: LEDGER_PAGE_SIZE })}`,
          ledgerPageSchema,
        ),
      initialPageParam: null as number | null,
      getNextPageParam: (last) => last.nextCursor,
    }),
  restockRun: () =>
    queryOptions({
      queryKey: [...stockQueries.all(), 'restock-run'] as const,
      queryFn: () => apiClient.get('/api/stock/restock-run', restockRunSchema),
    }),
  parLevels: () =>
    queryOptions({
      queryKey: [...stockQueries.all(), 'par-levels'] as const,
      queryFn: async () => (await apiClient.get('/api/par-levels', parLevelListResponseSchema)).parLevels,
    }),
  /** Booked jobs of the restock window whose van does not hold their packs; one engineer's, or all. */
  bookedJobsShort: (engineerMemberId?: number) =>
    queryOptions({
      queryKey: [...stockQueries.all(), 'booked-jobs-short', engineerMemberId ?? 'all'] as const,
      queryFn: () =>
        apiClient.get(`/api/stock/booked-jobs-short${searchOf({ engineerMemberId })}`, bookedJobsShortSchema),
    }),
  mine: () =>
    queryOptions({
      queryKey: [...stockQueries.all(), 'mine'] as const,
      queryFn: () => apiClient.get('/api/me/van/stock', myVanStockSchema),
    }),
};
