import { useMutation, useQueryClient } from '@tanstack/react-query';
import { vanResponseSchema, type CreateVanInput, type UpdateVanInput } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { vanQueries } from '@/features/vans/api/van-queries';

export async function createVan(input: CreateVanInput) {
  return (await apiClient.post('/api/vans', input, vanResponseSchema)).van;
}

export async function updateVan({ id, ...input }: UpdateVanInput & { id: number }) {
  return (await apiClient.patch(`/api/vans/${id}`, input, vanResponseSchema)).van;
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
