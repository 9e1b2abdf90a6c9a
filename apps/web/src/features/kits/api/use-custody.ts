import { useMutation, useQueryClient } from '@tanstack/react-query';
import {
  itemCustodyResponseSchema,
  kitDetailResponseSchema,
  type CheckInInput,
  type CheckOutInput,
  type MoveInput,
} from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { kitItemQueries, kitQueries } from '@/features/kits/api/kit-queries';

export type CustodyScope = { kind: 'kit'; id: number } | { kind: 'item'; id: number };

export type CustodyRequest =
  | { action: 'check-out'; input: CheckOutInput }
  | { action: 'check-in'; input: CheckInInput }
  | { action: 'move'; input: MoveInput };

/** The kit or the item as it now stands, with its custody timeline. */
export async function sendCustody(scope: CustodyScope, request: CustodyRequest, idempotencyKey: string) {
  if (scope.kind === 'kit')
    return apiClient.post(`/api/kits/${scope.id}/${request.action}`, request.input, kitDetailResponseSchema, {
      idempotencyKey,
    });
  return apiClient.post(`/api/kit-items/${scope.id}/${request.action}`, request.input, itemCustodyResponseSchema, {
    idempotencyKey,
  });
}

export function useCustody() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({
      scope,
      request,
      idempotencyKey,
    }: {
      scope: CustodyScope;
      request: CustodyRequest;
      idempotencyKey: string;
    }) => sendCustody(scope, request, idempotencyKey),
    // A kit's check-out moves every item in it, so both kits and items change.
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: kitQueries.all() }),
        queryClient.invalidateQueries({ queryKey: kitItemQueries.all() }),
      ]),
  });
}
