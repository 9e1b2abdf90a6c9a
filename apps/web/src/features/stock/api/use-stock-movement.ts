import { useMutation, useQueryClient } from '@tanstack/react-query';
import {
  restockAppliedSchema,
  stockMovedSchema,
  type ReceiptInput,
  type RestockApplyInput,
  type StocktakeInput,
  type TransferInput,
  type UsageInput,
  type WriteOffInput,
} from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { stockQueries } from '@/features/stock/api/stock-queries';

export type StockMovementRequest =
  | { action: 'receipts'; input: ReceiptInput }
  | { action: 'transfers'; input: TransferInput }
  | { action: 'usages'; input: UsageInput }
  | { action: 'stocktakes'; input: StocktakeInput }
  | { action: 'write-offs'; input: WriteOffInput };

export function sendStockMovement(request: StockMovementRequest, idempotencyKey: string) {
  return apiClient.post(`/api/stock/${request.action}`, request.input, stockMovedSchema, { idempotencyKey });
}

/** Every stock form goes through here; any movement can change the grid, batches, ledger, plan and van stock. */
export function useStockMovement() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ request, idempotencyKey }: { request: StockMovementRequest; idempotencyKey: string }) =>
      sendStockMovement(request, idempotencyKey),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: stockQueries.all() }),
  });
}

export function useReverseMovement() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({
      movementId,
      reason,
      idempotencyKey,
    }: {
      movementId: number;
      reason: string;
      idempotencyKey: string;
    }) =>
      apiClient.post(`/api/stock/movements/${movementId}/reverse`, { reason }, stockMovedSchema, { idempotencyKey }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: stockQueries.all() }),
  });
}

export function useApplyRestockRun() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ lines, idempotencyKey }: { lines: RestockApplyInput['lines']; idempotencyKey: string }) =>
      apiClient.post('/api/stock/restock-run', { lines }, restockAppliedSchema, { idempotencyKey }),
    // A refused run (stock moved since it was computed) is recomputed too, so the next try starts from the truth.
    onSettled: () => queryClient.invalidateQueries({ queryKey: stockQueries.all() }),
  });
}
