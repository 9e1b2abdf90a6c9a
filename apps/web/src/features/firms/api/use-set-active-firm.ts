import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { changeActiveFirm, meEnvelopeSchema } from '@/lib/auth';

export function setActiveFirm(firmId: number) {
  return apiClient.put('/api/me/active-firm', { firmId }, meEnvelopeSchema);
}

export function useSetActiveFirm() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: setActiveFirm,
    onSuccess: ({ me }) => changeActiveFirm(queryClient, me),
  });
}
