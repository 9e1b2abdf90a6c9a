import { queryOptions } from '@tanstack/react-query';
import { z } from 'zod';
import { invitationPreviewSchema } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';

const previewEnvelopeSchema = z.object({ invitation: invitationPreviewSchema });

export async function getInvitationPreview(token: string) {
  return (await apiClient.get(`/api/invitations/by-token/${encodeURIComponent(token)}`, previewEnvelopeSchema)).invitation;
}

export const invitationPreviewQueries = {
  all: () => ['invitation-previews'] as const,
  byToken: (token: string) =>
    queryOptions({
      queryKey: [...invitationPreviewQueries.all(), token] as const,
      queryFn: () => getInvitationPreview(token),
      // A used link never becomes valid again; refetching would only replace the form with a 404.
      staleTime: Infinity,
      refetchOnWindowFocus: false,
    }),
};
