import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import {
  itemKindListResponseSchema,
  kitDetailResponseSchema,
  kitItemDetailResponseSchema,
  kitItemPageResponseSchema,
  kitListResponseSchema,
  type KitItemListQuery,
} from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';

/** The items list's filters as the URL query the API reads; page numbers start at 1. */
export type KitItemFilters = Partial<Omit<KitItemListQuery, 'page' | 'pageSize'>> & { page: number; pageSize: number };

function toSearchParams(filters: KitItemFilters): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(filters)) {
    if (value !== undefined && value !== '') params.set(key, String(value));
  }
  return params.toString();
}

export async function listKits() {
  return (await apiClient.get('/api/kits', kitListResponseSchema)).kits;
}

export function getKit(id: number) {
  return apiClient.get(`/api/kits/${id}`, kitDetailResponseSchema);
}

export function listKitItems(filters: KitItemFilters) {
  return apiClient.get(`/api/kit-items?${toSearchParams(filters)}`, kitItemPageResponseSchema);
}

export function getKitItem(id: number) {
  return apiClient.get(`/api/kit-items/${id}`, kitItemDetailResponseSchema);
}

export async function listItemKinds() {
  return (await apiClient.get('/api/item-kinds', itemKindListResponseSchema)).itemKinds;
}

export const kitQueries = {
  all: () => ['kits'] as const,
  lists: () => [...kitQueries.all(), 'list'] as const,
  list: () => queryOptions({ queryKey: kitQueries.lists(), queryFn: listKits }),
  details: () => [...kitQueries.all(), 'detail'] as const,
  detail: (id: number) => queryOptions({ queryKey: [...kitQueries.details(), id] as const, queryFn: () => getKit(id) }),
};

export const kitItemQueries = {
  all: () => ['kit-items'] as const,
  lists: () => [...kitItemQueries.all(), 'list'] as const,
  list: (filters: KitItemFilters) =>
    queryOptions({
      queryKey: [...kitItemQueries.lists(), filters] as const,
      queryFn: () => listKitItems(filters),
      // Keep the page on screen while the next one loads, so the table does not jump.
      placeholderData: keepPreviousData,
    }),
  details: () => [...kitItemQueries.all(), 'detail'] as const,
  detail: (id: number) =>
    queryOptions({ queryKey: [...kitItemQueries.details(), id] as const, queryFn: () => getKitItem(id) }),
};

export const itemKindQueries = {
  all: () => ['item-kinds'] as const,
  lists: () => [...itemKindQueries.all(), 'list'] as const,
  list: () => queryOptions({ queryKey: itemKindQueries.lists(), queryFn: listItemKinds }),
};
