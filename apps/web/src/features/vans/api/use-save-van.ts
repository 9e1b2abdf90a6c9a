import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateVanInput, UpdateVanInput } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { vanEnvelopeSchema, vanQueries } from '@/features/vans/api/van-queries';

export async function createVan(input: CreateVanInput) {
  return (await apiClient.post('/api/vans', input, vanEnvelopeSchema)).van;
}

export async function updateVan({ id, ...input }: UpdateVanInput & { id: number }) {
  return (await apiClient.patch(`/api/vans/${id}`, input, vanEnvelopeSchema)).van;
}

export function useCreateVan() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createVan,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: vanQueries.all() }),
  });
}

export function useUpdateVan() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateVan,
    // The van shows in lists, its own page and "My van": all of them may change.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: vanQueries.all() }),
  });
}
