import { useMutation, useQueryClient } from '@tanstack/react-query';
import {
  kitItemResponseSchema,
  kitResponseSchema,
  type CreateKitInput,
  type CreateKitItemInput,
  type UpdateKitItemInput,
  type updateKitInputSchema,
} from '@heatfleet/domain';
import type { z } from 'zod';
import { apiClient } from '@/lib/api-client';
import { kitItemQueries, kitQueries } from '@/features/kits/api/kit-queries';

export async function createKit(input: CreateKitInput) {
  return (await apiClient.post('/api/kits', input, kitResponseSchema)).kit;
}

export async function updateKit({ id, ...input }: z.infer<typeof updateKitInputSchema> & { id: number }) {
  return (await apiClient.patch(`/api/kits/${id}`, input, kitResponseSchema)).kit;
}

export async function createKitItem(input: CreateKitItemInput) {
  return (await apiClient.post('/api/kit-items', input, kitItemResponseSchema)).item;
}

export async function updateKitItem({ id, ...input }: UpdateKitItemInput & { id: number }) {
  return (await apiClient.patch(`/api/kit-items/${id}`, input, kitItemResponseSchema)).item;
}

export function useCreateKit() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createKit,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: kitQueries.lists() }),
  });
}

function useInvalidateKitsAndItems() {
  const queryClient = useQueryClient();
  return () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: kitItemQueries.all() }),
      queryClient.invalidateQueries({ queryKey: kitQueries.all() }),
    ]);
}

export function useCreateKitItem() {
  const invalidate = useInvalidateKitsAndItems();
  return useMutation({ mutationFn: createKitItem, onSuccess: invalidate });
}

export function useUpdateKitItem() {
  const invalidate = useInvalidateKitsAndItems();
  return useMutation({ mutationFn: updateKitItem, onSuccess: invalidate });
}

export function useUpdateKit() {
  const invalidate = useInvalidateKitsAndItems();
  // Items carry their kit's name, so both lists change.
  return useMutation({ mutationFn: updateKit, onSuccess: invalidate });
}
