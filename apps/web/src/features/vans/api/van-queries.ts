import { queryOptions } from '@tanstack/react-query';
import {
  depotListResponseSchema,
  myVanResponseSchema,
  vanDetailResponseSchema,
  vanListResponseSchema,
} from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { queryRoots } from '@/lib/query-keys';

export async function listVans() {
  return (await apiClient.get('/api/vans', vanListResponseSchema)).vans;
}

export function getVan(id: number) {
  return apiClient.get(`/api/vans/${id}`, vanDetailResponseSchema);
}

export function getMyVan() {
  return apiClient.get('/api/me/van', myVanResponseSchema);
}

export async function listDepots() {
  return (await apiClient.get('/api/depots', depotListResponseSchema)).depots;
}

export const vanQueries = {
  all: () => queryRoots.vans,
  lists: () => [...vanQueries.all(), 'list'] as const,
  list: () => queryOptions({ queryKey: vanQueries.lists(), queryFn: listVans }),
  details: () => [...vanQueries.all(), 'detail'] as const,
  detail: (id: number) => queryOptions({ queryKey: [...vanQueries.details(), id] as const, queryFn: () => getVan(id) }),
  mine: () => queryOptions({ queryKey: [...vanQueries.all(), 'mine'] as const, queryFn: getMyVan }),
};

export const depotQueries = {
  all: () => ['depots'] as const,
  lists: () => [...depotQueries.all(), 'list'] as const,
  list: () => queryOptions({ queryKey: depotQueries.lists(), queryFn: listDepots, staleTime: 5 * 60_000 }),
};
