import { useMutation, useQueryClient } from '@tanstack/react-query';
import {
  parLevelResponseSchema,
  productResponseSchema,
  type ParLevelInput,
  type ProductInput,
} from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { productQueries, stockQueries } from '@/features/stock/api/stock-queries';

export function useCreateProduct() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (input: ProductInput) =>
      (await apiClient.post('/api/products', input, productResponseSchema)).product,
    // A new product also gains a row in the stock grid.
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: productQueries.all() }),
        queryClient.invalidateQueries({ queryKey: stockQueries.all() }),
      ]),
  });
}

export function useUpdateProduct() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async ({ id, input }: { id: number; input: ProductInput }) =>
      (await apiClient.put(`/api/products/${id}`, input, productResponseSchema)).product,
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: productQueries.all() }),
        queryClient.invalidateQueries({ queryKey: stockQueries.all() }),
      ]),
  });
}

export function useUploadSafetyDataSheet() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async ({ id, file }: { id: number; file: File }) => {
      const form = new FormData();
      form.append('file', file);
      return (await apiClient.upload(`/api/products/${id}/safety-data-sheet`, form, productResponseSchema)).product;
    },
    onSuccess: () => queryClient.invalidateQueries({ queryKey: productQueries.all() }),
  });
}

export function useSetParLevel() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ParLevelInput) => apiClient.put('/api/par-levels', input, parLevelResponseSchema),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: stockQueries.all() }),
  });
}
