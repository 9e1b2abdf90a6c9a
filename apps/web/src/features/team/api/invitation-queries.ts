import { queryOptions } from '@tanstack/react-query';
import { z } from 'zod';
import { invitationSchema } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';

const invitationsEnvelopeSchema = z.object({ invitations: z.array(invitationSchema) });
export const invitationEnvelopeSchema = z.object({ invitation: invitationSchema });

export async function listPendingInvitations() {
  return (await apiClient.get('/api/invitations', invitationsEnvelopeSchema)).invitations;
}

export const invitationQueries = {
  all: () => ['invitations'] as const,
  lists: () => [...invitationQueries.all(), 'list'] as const,
  pending: () =>
    queryOptions({ queryKey: [...invitationQueries.lists(), 'pending'] as const, queryFn: listPendingInvitations }),
};
