import { queryOptions } from '@tanstack/react-query';
import { invitationPreviewResponseSchema } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';

export async function getInvitationPreview(token: string) {
  return (
    await apiClient.get(`/api/invitations/by-token/${encodeURIComponent(token)}`, invitationPreviewResponseSchema)
  ).invitation;
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
