import { useState, type FormEvent } from 'react';
import { invoiceLinesInputSchema, parsePounds, type Invoice } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { isApiError } from '@/lib/api-client';
import { firstErrorPerField, type FieldErrors } from '@/lib/form';
import { penceToPoundsText, useSaveInvoiceLines } from '../api/price-invoice-actions';

type Row = Pick<Invoice['lines'][number], 'kind' | 'priceItemId' | 'productId'> & {
  description: string;
  quantity: string;
  unit: string;
};

const toRows = (invoice: Invoice): Row[] =>
  invoice.lines.map((l) => ({
    kind: l.kind,
    priceItemId: l.priceItemId,
    productId: l.productId,
    description: l.description,
    quantity: String(l.quantity),
    unit: penceToPoundsText(l.unitPence),
  }));

/** A draft invoice's lines, changed on the phone: prices typed in pounds ("12.50") and sent as whole pence. */
export function InvoiceLinesEditor({ invoice }: { invoice: Invoice }) {
  const save = useSaveInvoiceLines(invoice.id);
  const [rows, setRows] = useState<Row[]>(() => toRows(invoice));
  const [errors, setErrors] = useState<FieldErrors>({});
  const set = (i: number, patch: Partial<Row>) => setRows(rows.map((r, j) => (j === i ? { ...r, ...patch } : r)));

  function submit(event: FormEvent) {
    event.preventDefault();
    const parsed = invoiceLinesInputSchema.safeParse({
      lines: rows.map((r) => ({
        kind: r.kind,
        priceItemId: r.priceItemId,
        productId: r.productId,
        description: r.description,
        quantity: /^\d+$/.test(r.quantity.trim()) ? Number(r.quantity) : r.quantity,
        unitPence: parsePounds(r.unit) ?? r.unit,
      })),
    });
    if (!parsed.success) return setErrors(firstErrorPerField(parsed.error.issues));
    setErrors({});
    save.mutate(parsed.data.lines, {
      onSuccess: (saved) => setRows(toRows(saved as Invoice)),
      onError: (e) => setErrors(isApiError(e) ? firstErrorPerField(e.details) : {}),
    });
  }

  return (
    <form noValidate aria-label="Invoice lines" className="space-y-3" onSubmit={submit}>
      {save.isError ? <Alert tone="error">{save.error.message}</Alert> : null}
      {save.isSuccess ? <Alert tone="success">Lines saved.</Alert> : null}
      {errors.lines ? <Alert tone="error">{errors.lines}</Alert> : null}
      {rows.map((r, i) => (
        <div key={i} className="grid gap-2 rounded-md border p-3 sm:grid-cols-[2fr_1fr_1fr_auto] sm:items-end">
          <TextField
            label={`Line ${i + 1}`}
            name={`lines.${i}.description`}
            value={r.description}
            onChange={(e) => set(i, { description: e.target.value })}
            error={errors[`lines.${i}.description`]}
          />
          <TextField
            label="Quantity"
            name={`lines.${i}.quantity`}
            inputMode="numeric"
            value={r.quantity}
            onChange={(e) => set(i, { quantity: e.target.value })}
            error={errors[`lines.${i}.quantity`]}
          />
          <TextField
            label={invoice.vatRegistered ? 'Unit price excl. VAT (£)' : 'Unit price (£)'}
            name={`lines.${i}.unitPence`}
            inputMode="decimal"
            value={r.unit}
            onChange={(e) => set(i, { unit: e.target.value })}
            error={errors[`lines.${i}.unitPence`]}
          />
          <Button
            variant="quiet"
            aria-label={`Remove line ${i + 1}`}
            onClick={() => setRows(rows.filter((_, j) => j !== i))}
          >
            Remove
          </Button>
        </div>
      ))}
      <div className="flex flex-wrap gap-3">
        <Button
          variant="secondary"
          onClick={() =>
            setRows([
              ...rows,
              { kind: 'other', priceItemId: null, productId: null, description: '', quantity: '1', unit: '' },
            ])
          }
        >
          Add a line
        </Button>
        <Button type="submit" busy={save.isPending}>
          Save lines
        </Button>
      </div>
    </form>
  );
}
