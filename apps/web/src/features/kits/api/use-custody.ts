import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { custodyEventSchema, type CheckInInput, type CheckOutInput, type MoveInput } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { kitItemQueries, kitQueries } from '@/features/kits/api/kit-queries';

export type CustodyScope = { kind: 'kit'; id: number } | { kind: 'item'; id: number };

export type CustodyRequest =
  | { action: 'check-out'; input: CheckOutInput }
  | { action: 'check-in'; input: CheckInInput }
  | { action: 'move'; input: MoveInput };

const custodyAnswerSchema = z.object({ events: z.array(custodyEventSchema) });

export async function sendCustody(scope: CustodyScope, request: CustodyRequest, idempotencyKey: string) {
  const base = scope.kind === 'kit' ? `/api/kits/${scope.id}` : `/api/kit-items/${scope.id}`;
  return apiClient.post(`${base}/${request.action}`, request.input, custodyAnswerSchema, { idempotencyKey });
}

export function useCustody() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ scope, request, idempotencyKey }: { scope: CustodyScope; request: CustodyRequest; idempotencyKey: string }) =>
      sendCustody(scope, request, idempotencyKey),
    // A kit's check-out moves every item in it, so both kits and items change.
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: kitQueries.all() }),
        queryClient.invalidateQueries({ queryKey: kitItemQueries.all() }),
      ]),
  });
}
