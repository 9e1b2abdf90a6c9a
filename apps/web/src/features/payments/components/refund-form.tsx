import { useState, type FormEvent } from 'react';
import { formatPence, parsePounds, refundInputSchema } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { useIdempotencyKey } from '@/lib/idempotency';
import { useRefund } from '../api/payment-queries';

/** Refund all that is left of a card payment, or part of it (Owner, Admin). */
export function RefundForm({
  invoiceId,
  paymentId,
  leftPence,
}: {
  invoiceId: number;
  paymentId: number;
  leftPence: number;
}) {
  const refund = useRefund(invoiceId);
  const keys = useIdempotencyKey();
  const [amount, setAmount] = useState('');
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    setError(null);
    setDone(null);
    const pence = amount.trim() === '' ? undefined : parsePounds(amount);
    if (pence === null) return setError('Give the amount in pounds and pence, e.g. 25.00, or leave it empty.');
    const input = refundInputSchema.safeParse({ amountPence: pence, reason: reason.trim() || undefined });
    if (!input.success) return setError(input.error.issues[0]?.message ?? 'Check the amount.');
    refund.mutate(
      { paymentId, input: input.data, idempotencyKey: keys.keyFor({ paymentId, ...input.data }) },
      {
        onSuccess: () => {
          keys.done();
          setDone(`Refunded ${formatPence(input.data.amountPence ?? leftPence)}.`);
          setAmount('');
          setReason('');
        },
        onError: (e) => setError(e.message),
      },
    );
  };

  return (
    <form onSubmit={submit} className="space-y-3" aria-label={`Refund payment ${paymentId}`}>
      <TextField
        label="Amount to refund (£)"
        name="amount"
        inputMode="decimal"
        hint={`Leave empty to refund all that is left: ${formatPence(leftPence)}.`}
        value={amount}
        onChange={(e) => setAmount(e.target.value)}
      />
      <TextField
        label="Reason (optional)"
        name="reason"
        value={reason}
        maxLength={200}
        onChange={(e) => setReason(e.target.value)}
      />
      <Button type="submit" variant="danger" busy={refund.isPending}>
        Refund
      </Button>
      {error ? <Alert tone="error">{error}</Alert> : null}
      {done ? <Alert tone="success">{done}</Alert> : null}
    </form>
  );
}
