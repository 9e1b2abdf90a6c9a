import { queryOptions } from '@tanstack/react-query';
import { z } from 'zod';
import { depotSchema, kitItemSchema, kitSchema, vanSchema } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { queryRoots } from '@/lib/query-keys';

const vansEnvelopeSchema = z.object({ vans: z.array(vanSchema) });
export const vanEnvelopeSchema = z.object({ van: vanSchema });
const vanDetailSchema = z.object({ van: vanSchema, kits: z.array(kitSchema), items: z.array(kitItemSchema) });
const myVanSchema = z.object({ van: vanSchema.nullable(), kits: z.array(kitSchema), items: z.array(kitItemSchema) });
const depotsEnvelopeSchema = z.object({ depots: z.array(depotSchema) });
export const depotEnvelopeSchema = z.object({ depot: depotSchema });

export async function listVans() {
  return (await apiClient.get('/api/vans', vansEnvelopeSchema)).vans;
}

export function getVan(id: number) {
  return apiClient.get(`/api/vans/${id}`, vanDetailSchema);
}

export function getMyVan() {
  return apiClient.get('/api/me/van', myVanSchema);
}

export async function listDepots() {
  return (await apiClient.get('/api/depots', depotsEnvelopeSchema)).depots;
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
