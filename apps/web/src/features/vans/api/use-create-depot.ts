import { useMutation, useQueryClient } from '@tanstack/react-query';
import { depotResponseSchema, type CreateDepotInput } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { depotQueries } from '@/features/vans/api/van-queries';

export async function createDepot(input: CreateDepotInput) {
  return (await apiClient.post('/api/depots', input, depotResponseSchema)).depot;
}

export function useCreateDepot() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createDepot,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: depotQueries.lists() }),
  });
}
