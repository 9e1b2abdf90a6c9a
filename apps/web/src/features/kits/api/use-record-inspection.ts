import { useMutation, useQueryClient } from '@tanstack/react-query';
import { inspectionRecordedResponseSchema, type RecordInspectionInput } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { kitItemQueries, kitQueries } from '@/features/kits/api/kit-queries';

export function recordInspection(itemId: number, input: RecordInspectionInput, idempotencyKey: string) {
  return apiClient.post(`/api/kit-items/${itemId}/inspections`, input, inspectionRecordedResponseSchema, {
    idempotencyKey,
  });
}

export function useRecordInspection() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({
      itemId,
      input,
      idempotencyKey,
    }: {
      itemId: number;
      input: RecordInspectionInput;
      idempotencyKey: string;
    }) => recordInspection(itemId, input, idempotencyKey),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: kitItemQueries.all() }),
        // A kit shows its worst due state, which this inspection may have changed.
        queryClient.invalidateQueries({ queryKey: kitQueries.all() }),
      ]),
  });
}
