import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateDepotInput } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { depotEnvelopeSchema, depotQueries } from '@/features/vans/api/van-queries';

export async function createDepot(input: CreateDepotInput) {
  return (await apiClient.post('/api/depots', input, depotEnvelopeSchema)).depot;
}

export function useCreateDepot() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createDepot,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: depotQueries.lists() }),
  });
}
