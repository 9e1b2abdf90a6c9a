import { useMutation, useQueryClient } from '@tanstack/react-query';
import { itemKindResponseSchema, type ItemKindInput } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { itemKindQueries, kitItemQueries } from '@/features/kits/api/kit-queries';

export async function createItemKind(input: ItemKindInput) {
  return (await apiClient.post('/api/item-kinds', input, itemKindResponseSchema)).itemKind;
}

export async function updateItemKind({ id, ...input }: ItemKindInput & { id: number }) {
  return (await apiClient.patch(`/api/item-kinds/${id}`, input, itemKindResponseSchema)).itemKind;
}

export function useSaveItemKind() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id?: number; input: ItemKindInput }) =>
      id === undefined ? createItemKind(input) : updateItemKind({ id, ...input }),
    // A changed rule changes every due date of that kind.
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: itemKindQueries.all() }),
        queryClient.invalidateQueries({ queryKey: kitItemQueries.all() }),
      ]),
  });
}
