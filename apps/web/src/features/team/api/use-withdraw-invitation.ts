import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { invitationQueries } from '@/features/team/api/invitation-queries';

export function withdrawInvitation(id: number) {
  return apiClient.send('DELETE', `/api/invitations/${id}`);
}

export function useWithdrawInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: withdrawInvitation,
    onSettled: () => queryClient.invalidateQueries({ queryKey: invitationQueries.lists() }),
  });
}
