import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import {
  quoteListSchema,
  quoteSchema,
  suggestedLinesSchema,
  type MoneyLineInput,
  type Quote,
  type QuotePhoneAcceptInput,
} from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';

// A job's quotes for the engineer (DEVELOPERS.md, "Money"): made from the job's priced lines, changed while a
// draft, e-mailed with a link, or accepted on the phone with the customer's signature.

export const quoteQueries = {
  all: () => ['quotes'] as const,
  forJob: (jobId: number) =>
    queryOptions({
      queryKey: [...quoteQueries.all(), 'job', jobId] as const,
      queryFn: async () => (await apiClient.get(`/api/quotes?jobId=${jobId}`, quoteListSchema)).quotes,
    }),
};

export const quotePdfHrefFor = (id: number) => `/api/quotes/${id}/quote.pdf`;

export function useQuoteMutations(jobId: number) {
  const queryClient = useQueryClient();
  const key = quoteQueries.forJob(jobId).queryKey;
  // The answer is the quote as it now is: put it in the job's list in place (newest first), then re-read.
  const done = (quote: Quote) => {
    queryClient.setQueryData(key, (old: Quote[] | undefined) =>
      old?.some((q) => q.id === quote.id) ? old.map((q) => (q.id === quote.id ? quote : q)) : [quote, ...(old ?? [])],
    );
    void queryClient.invalidateQueries({ queryKey: key });
  };
  return {
    make: useMutation({
      mutationFn: async () => {
        const { lines } = await apiClient.get(`/api/jobs/${jobId}/price-lines`, suggestedLinesSchema);
        if (lines.length === 0)
          throw new Error('The price list has no price for this job yet. Ask the office to add the visit’s price.');
        return apiClient.post('/api/quotes', { jobId, lines }, quoteSchema);
      },
      onSuccess: done,
    }),
    change: useMutation({
      mutationFn: ({ id, lines }: { id: number; lines: MoneyLineInput[] }) =>
        apiClient.put(`/api/quotes/${id}`, { lines }, quoteSchema),
      onSuccess: done,
    }),
    send: useMutation({
      mutationFn: (id: number) => apiClient.post(`/api/quotes/${id}/send`, {}, quoteSchema),
      onSuccess: done,
    }),
    accept: useMutation({
      mutationFn: ({ id, input }: { id: number; input: QuotePhoneAcceptInput }) =>
        apiClient.post(`/api/quotes/${id}/accept`, input, quoteSchema),
      onSuccess: done,
    }),
  };
}
