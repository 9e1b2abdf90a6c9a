import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { billingResponseSchema, billingStatusSchema, onboardingLinkSchema } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';

export const billingQueries = {
  all: () => ['billing'] as const,
  detail: () =>
    queryOptions({
      queryKey: [...billingQueries.all(), 'detail'] as const,
      queryFn: () => apiClient.get('/api/billing', billingResponseSchema, { fresh: true }),
    }),
  status: () =>
    queryOptions({
      queryKey: [...billingQueries.all(), 'status'] as const,
      queryFn: () => apiClient.get('/api/billing/status', billingStatusSchema),
      staleTime: 60_000,
    }),
};

export function startCardSetup() {
  return apiClient.post('/api/billing/card', {}, onboardingLinkSchema);
}

export function usePayNow() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => apiClient.post('/api/billing/pay', {}, billingResponseSchema),
    onSuccess: (billing) => {
      queryClient.setQueryData(billingQueries.detail().queryKey, billing);
      void queryClient.invalidateQueries({ queryKey: billingQueries.status().queryKey });
    },
  });
}
