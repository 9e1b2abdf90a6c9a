import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ChangePasswordInput } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { sessionEnvelopeSchema, renewSession } from '@/lib/auth';

export function changePassword(input: ChangePasswordInput) {
  return apiClient.put('/api/me/password', input, sessionEnvelopeSchema);
}

export function useChangePassword() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: changePassword,
    // The API rotates the session (other sessions end), so the token changes with it.
    onSuccess: (session) => renewSession(queryClient, session),
  });
}
