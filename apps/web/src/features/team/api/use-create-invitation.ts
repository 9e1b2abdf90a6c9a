import { useMutation, useQueryClient } from '@tanstack/react-query';
import { invitationResponseSchema, type CreateInvitationInput } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { invitationQueries } from '@/features/team/api/invitation-queries';

export async function createInvitation(input: CreateInvitationInput) {
  return (await apiClient.post('/api/invitations', input, invitationResponseSchema)).invitation;
}

export function useCreateInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createInvitation,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: invitationQueries.lists() }),
  });
}
