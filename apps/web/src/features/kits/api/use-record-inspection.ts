import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { inspectionSchema, kitItemSchema, type RecordInspectionInput } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { kitItemQueries, kitQueries } from '@/features/kits/api/kit-queries';

const inspectionAnswerSchema = z.object({ inspection: inspectionSchema, item: kitItemSchema });

export function recordInspection(itemId: number, input: RecordInspectionInput, idempotencyKey: string) {
  return apiClient.post(`/api/kit-items/${itemId}/inspections`, input, inspectionAnswerSchema, { idempotencyKey });
}

export function useRecordInspection() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ itemId, input, idempotencyKey }: { itemId: number; input: RecordInspectionInput; idempotencyKey: string }) =>
      recordInspection(itemId, input, idempotencyKey),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: kitItemQueries.all() }),
        // A kit shows its worst due state, which this inspection may have changed.
        queryClient.invalidateQueries({ queryKey: kitQueries.all() }),
      ]),
  });
}
