import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { publicQuoteSchema, type QuoteAcceptInput } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';

const pathOf = (token: string) => `/api/public/quotes/${encodeURIComponent(token)}`;

export const quoteLinkQueries = {
  all: () => ['quote-link'] as const,
  byToken: (token: string) =>
    queryOptions({
      queryKey: [...quoteLinkQueries.all(), token] as const,
      queryFn: () => apiClient.get(pathOf(token), publicQuoteSchema),
      retry: false,
    }),
};

export const quotePdfHref = (token: string) => `${pathOf(token)}/quote.pdf`;

export function useAnswerQuote(token: string) {
  const queryClient = useQueryClient();
  const done = (answer: unknown) =>
    queryClient.setQueryData(quoteLinkQueries.byToken(token).queryKey, publicQuoteSchema.parse(answer));
  return {
    accept: useMutation({
      mutationFn: (input: QuoteAcceptInput) => apiClient.post(`${pathOf(token)}/accept`, input, publicQuoteSchema),
      onSuccess: done,
    }),
    decline: useMutation({
      mutationFn: (reason: string) => apiClient.post(`${pathOf(token)}/decline`, { reason }, publicQuoteSchema),
      onSuccess: done,
    }),
  };
}
