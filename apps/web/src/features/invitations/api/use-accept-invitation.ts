import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AcceptInvitationInput } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { sessionEnvelopeSchema, startSession } from '@/lib/auth';

export function acceptInvitation({ token, ...input }: AcceptInvitationInput & { token: string }) {
  return apiClient.post(`/api/invitations/by-token/${encodeURIComponent(token)}/accept`, input, sessionEnvelopeSchema);
}

export function useAcceptInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: acceptInvitation,
    onSuccess: (session) => startSession(queryClient, session),
  });
}
