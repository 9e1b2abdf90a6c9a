import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import { z } from 'zod';
import {
  custodyEventSchema,
  inspectionSchema,
  itemKindSchema,
  kitItemSchema,
  kitSchema,
  photoSchema,
  type KitItemListQuery,
} from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';

const kitsEnvelopeSchema = z.object({ kits: z.array(kitSchema) });
export const kitEnvelopeSchema = z.object({ kit: kitSchema });
const kitDetailSchema = z.object({
  kit: kitSchema,
  items: z.array(kitItemSchema),
  events: z.array(custodyEventSchema),
  inspections: z.array(inspectionSchema),
});
export const kitItemEnvelopeSchema = z.object({ item: kitItemSchema });
const kitItemPageSchema = z.object({ items: z.array(kitItemSchema), total: z.number(), page: z.number(), pageSize: z.number() });
const kitItemDetailSchema = z.object({
  item: kitItemSchema,
  events: z.array(custodyEventSchema),
  inspections: z.array(inspectionSchema),
  photos: z.array(photoSchema),
});
const itemKindsEnvelopeSchema = z.object({ itemKinds: z.array(itemKindSchema) });
export const itemKindEnvelopeSchema = z.object({ itemKind: itemKindSchema });

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
  return (await apiClient.get('/api/kits', kitsEnvelopeSchema)).kits;
}

export function getKit(id: number) {
  return apiClient.get(`/api/kits/${id}`, kitDetailSchema);
}

export function listKitItems(filters: KitItemFilters) {
  return apiClient.get(`/api/kit-items?${toSearchParams(filters)}`, kitItemPageSchema);
}

export function getKitItem(id: number) {
  return apiClient.get(`/api/kit-items/${id}`, kitItemDetailSchema);
}

export async function listItemKinds() {
  return (await apiClient.get('/api/item-kinds', itemKindsEnvelopeSchema)).itemKinds;
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
  detail: (id: number) => queryOptions({ queryKey: [...kitItemQueries.details(), id] as const, queryFn: () => getKitItem(id) }),
};

export const itemKindQueries = {
  all: () => ['item-kinds'] as const,
  lists: () => [...itemKindQueries.all(), 'list'] as const,
  list: () => queryOptions({ queryKey: itemKindQueries.lists(), queryFn: listItemKinds }),
};
