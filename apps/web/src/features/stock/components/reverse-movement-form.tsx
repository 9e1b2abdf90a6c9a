import { movementKindLabels, reversalInputSchema, type Movement } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { useSchemaForm } from '@/lib/form';
import { useIdempotencyKey } from '@/lib/idempotency';
import { useReverseMovement } from '@/features/stock/api/use-stock-movement';

const fields = ['reason'] as const;

/** A mistake is put right by a new movement that undoes it; a transfer is undone as a whole, both legs. */
export function ReverseMovementForm({
  movement,
  onDone,
  onCancel,
}: {
  movement: Movement;
  onDone: (message: string) => void;
  onCancel: () => void;
}) {
  const reverse = useReverseMovement();
  const idempotency = useIdempotencyKey();
  const form = useSchemaForm(reversalInputSchema, fields);
  const isTransfer = movement.kind === 'transfer_in' || movement.kind === 'transfer_out';
  return (
    <form
      ref={form.formRef}
      noValidate
      aria-label="Reverse a movement"
      className="space-y-3 rounded-lg border-2 border-ember-500 bg-ember-100 p-3"
      onSubmit={form.handleSubmit((input) => {
        const body = { movementId: movement.id, reason: input.reason };
        reverse.mutate(
          { ...body, idempotencyKey: idempotency.keyFor(body) },
          {
            onSuccess: () => {
              idempotency.done();
              onDone(
                `Reversed: ${movementKindLabels[movement.kind].toLowerCase()} of ${Math.abs(movement.quantityDelta)} × ${movement.product.name} at ${movement.location.name}.`,
              );
            },
            onError: form.showError,
          },
        );
      })}
    >
      <p className="font-semibold">
        Reverse {movementKindLabels[movement.kind].toLowerCase()} of{' '}
        {movement.quantityDelta > 0 ? `+${movement.quantityDelta}` : movement.quantityDelta} × {movement.product.name},
        lot {movement.batch.lotNumber}, at {movement.location.name}?
      </p>
      {isTransfer ? <p className="text-sm">Both legs of the transfer are undone together.</p> : null}
      <TextField label="Why it is being reversed" name="reason" maxLength={300} error={form.fieldErrors.reason} />
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      <div className="flex flex-col gap-2 sm:flex-row">
        <Button type="submit" variant="danger" busy={reverse.isPending}>
          Reverse it
        </Button>
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
