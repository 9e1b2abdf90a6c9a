import { useMutation, useQueryClient } from '@tanstack/react-query';
import { meEnvelopeSchema, type CreateFirmInput } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { changeActiveFirm } from '@/lib/auth';

/** A further firm of the signed-in person's own: they become its Owner and work in it at once. */
export function createFirm(input: CreateFirmInput) {
  return apiClient.post('/api/me/firms', input, meEnvelopeSchema);
}

export function useCreateFirm() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createFirm,
    onSuccess: ({ me }) => changeActiveFirm(queryClient, me),
  });
}
