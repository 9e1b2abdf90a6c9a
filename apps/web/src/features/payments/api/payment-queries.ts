import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import {
  checkoutRedirectSchema,
  invoicePaymentsResponseSchema,
  onboardingLinkSchema,
  payLinkResponseSchema,
  paymentAccountSchema,
  paymentSchema,
  publicPayLinkSchema,
  type RefundInput,
} from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';

export const paymentQueries = {
  all: () => ['payments'] as const,
  account: () =>
    queryOptions({
      queryKey: [...paymentQueries.all(), 'account'] as const,
      queryFn: () => apiClient.get('/api/payments/account', paymentAccountSchema, { fresh: true }),
    }),
  invoice: (invoiceId: number) =>
    queryOptions({
      queryKey: [...paymentQueries.all(), 'invoice', invoiceId] as const,
      queryFn: () =>
        apiClient.get(`/api/invoices/${invoiceId}/payments`, invoicePaymentsResponseSchema, { fresh: true }),
    }),
  payLink: (token: string) =>
    queryOptions({
      queryKey: ['pay-link', token] as const,
      queryFn: () => apiClient.get(`/api/pay/${encodeURIComponent(token)}`, publicPayLinkSchema, { fresh: true }),
    }),
};

export function startOnboarding() {
  return apiClient.post('/api/payments/account/onboarding', {}, onboardingLinkSchema);
}

export function createPayLink(invoiceId: number) {
  return apiClient.post(`/api/invoices/${invoiceId}/pay-link`, {}, payLinkResponseSchema);
}

export function startCheckout(token: string, from: 'email_link' | 'doorstep') {
  return apiClient.post(`/api/pay/${encodeURIComponent(token)}/checkout`, { from }, checkoutRedirectSchema);
}

export function useRefund(invoiceId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (args: { paymentId: number; input: RefundInput; idempotencyKey: string }) =>
      apiClient.post(`/api/payments/${args.paymentId}/refunds`, args.input, paymentSchema, {
        idempotencyKey: args.idempotencyKey,
      }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: paymentQueries.invoice(invoiceId).queryKey }),
  });
}
