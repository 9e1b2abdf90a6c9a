import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { unsubscribePreviewResponseSchema } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';

const pathOf = (token: string) => `/api/unsubscribe/${encodeURIComponent(token)}`;

export const unsubscribeQueries = {
  all: () => ['unsubscribe'] as const,
  byToken: (token: string) =>
    queryOptions({
      queryKey: [...unsubscribeQueries.all(), token] as const,
      queryFn: async () => (await apiClient.get(pathOf(token), unsubscribePreviewResponseSchema)).unsubscribe,
      retry: false,
    }),
};

export function useUnsubscribe(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async () => (await apiClient.post(pathOf(token), {}, unsubscribePreviewResponseSchema)).unsubscribe,
    onSuccess: (answer) => queryClient.setQueryData(unsubscribeQueries.byToken(token).queryKey, answer),
  });
}
