import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { ParLevelInput, ProductInput } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { productEnvelopeSchema, productQueries, stockQueries } from '@/features/stock/api/stock-queries';

export function useCreateProduct() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (input: ProductInput) => (await apiClient.post('/api/products', input, productEnvelopeSchema)).product,
    // A new product also gains a row in the stock grid.
    onSuccess: () => Promise.all([queryClient.invalidateQueries({ queryKey: productQueries.all() }), queryClient.invalidateQueries({ queryKey: stockQueries.all() })]),
  });
}

export function useUpdateProduct() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async ({ id, input }: { id: number; input: ProductInput }) => (await apiClient.put(`/api/products/${id}`, input, productEnvelopeSchema)).product,
    onSuccess: () => Promise.all([queryClient.invalidateQueries({ queryKey: productQueries.all() }), queryClient.invalidateQueries({ queryKey: stockQueries.all() })]),
  });
}

export function useUploadSafetyDataSheet() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async ({ id, file }: { id: number; file: File }) => {
      const form = new FormData();
      form.append('file', file);
      return (await apiClient.upload(`/api/products/${id}/safety-data-sheet`, form, productEnvelopeSchema)).product;
    },
    onSuccess: () => queryClient.invalidateQueries({ queryKey: productQueries.all() }),
  });
}

export function useSetParLevel() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ParLevelInput) => apiClient.put('/api/par-levels', input, z.object({ parLevel: z.unknown() })),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: stockQueries.all() }),
  });
}
