import { queryOptions } from '@tanstack/react-query';
import { invitationListResponseSchema } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';

export async function listPendingInvitations() {
  return (await apiClient.get('/api/invitations', invitationListResponseSchema)).invitations;
}

export const invitationQueries = {
  all: () => ['invitations'] as const,
  lists: () => [...invitationQueries.all(), 'list'] as const,
  pending: () =>
    queryOptions({ queryKey: [...invitationQueries.lists(), 'pending'] as const, queryFn: listPendingInvitations }),
};
