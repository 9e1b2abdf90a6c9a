import { useState, type FormEvent } from 'react';
import { creditNoteInputSchema, formatPence, type Invoice } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { useCreditInvoice } from '../api/price-invoice-actions';

/**
 * A credit note against an issued invoice (it never changes itself): the whole invoice, or chosen quantities of
 * its lines, with a reason. The credit note takes its own number from its own sequence.
 */
export function InvoiceCreditForm({ invoice }: { invoice: Invoice }) {
  const credit = useCreditInvoice(invoice.id);
  const [reason, setReason] = useState('');
  const [whole, setWhole] = useState(true);
  const [qty, setQty] = useState<Record<number, string>>({});
  const [error, setError] = useState<string | null>(null);

  function submit(event: FormEvent) {
    event.preventDefault();
    const lines = whole
      ? undefined
      : invoice.lines
          .filter((l) => (qty[l.id] ?? '').trim() !== '' && qty[l.id] !== '0')
          .map((l) => ({ invoiceLineId: l.id, quantity: Number(qty[l.id]) }));
    if (lines && lines.length === 0) return setError('Give how many of at least one line to credit.');
    const parsed = creditNoteInputSchema.safeParse({ reason, lines });
    if (!parsed.success) return setError(parsed.error.issues[0]?.message ?? 'Check the credit note.');
    setError(null);
    credit.mutate(parsed.data, { onSuccess: () => setReason('') });
  }

  return (
    <form noValidate aria-label="Credit note" className="space-y-3" onSubmit={submit}>
      {error ? <Alert tone="error">{error}</Alert> : null}
      {credit.isError ? <Alert tone="error">{credit.error.message}</Alert> : null}
      {credit.isSuccess ? <Alert tone="success">Credit note made.</Alert> : null}
      <TextField label="Reason" name="reason" value={reason} onChange={(e) => setReason(e.target.value)} />
      <label className="flex min-h-12 items-center gap-3">
        <input
          type="checkbox"
          checked={whole}
          onChange={(e) => setWhole(e.target.checked)}
          className="size-5 accent-brand-700"
        />
        Credit the whole invoice
      </label>
      {whole
        ? null
        : invoice.lines.map((l) => (
            <TextField
              key={l.id}
              label={`${l.description} (${l.quantity} at ${formatPence(l.unitPence)}): how many to credit`}
              name={`credit-${l.id}`}
              inputMode="numeric"
              value={qty[l.id] ?? ''}
              onChange={(e) => setQty({ ...qty, [l.id]: e.target.value })}
            />
          ))}
      <Button type="submit" variant="danger" busy={credit.isPending}>
        Make the credit note
      </Button>
    </form>
  );
}
