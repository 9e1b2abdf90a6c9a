import { queryOptions } from '@tanstack/react-query';
import { invoiceListSchema, moneyOverviewSchema, priceListResponseSchema } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';

export const moneyQueries = {
  all: () => ['money'] as const,
  overview: () =>
    queryOptions({
      queryKey: [...moneyQueries.all(), 'overview'] as const,
      queryFn: () => apiClient.get('/api/money/overview', moneyOverviewSchema),
    }),
  invoices: () =>
    queryOptions({
      queryKey: [...moneyQueries.all(), 'invoices'] as const,
      queryFn: async () => (await apiClient.get('/api/invoices', invoiceListSchema)).invoices,
    }),
  prices: () =>
    queryOptions({
      queryKey: [...moneyQueries.all(), 'prices'] as const,
      queryFn: () => apiClient.get('/api/money/prices', priceListResponseSchema),
    }),
};

export const invoicePdfHref = (id: number) => `/api/invoices/${id}/invoice.pdf`;
export const exportHref = (from: string, to: string) =>
  `/api/money/export.csv?${new URLSearchParams({ from, to }).toString()}`;
