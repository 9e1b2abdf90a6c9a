import { useState } from 'react';
import { formatPence, parsePounds, type MoneyLine, type MoneyLineInput } from '@heatfleet/domain';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';

// The lines of a draft quote as the engineer changes them on the phone: amounts typed in pounds ("12.50") and
// turned into whole pence by the domain's parsePounds (never a float); quantities on the numeric keypad.

interface Row {
  key: number;
  base: Pick<MoneyLineInput, 'kind' | 'priceItemId' | 'productId'>;
  description: string;
  quantity: string;
  pounds: string;
}

const poundsOf = (pence: number) => formatPence(pence).replace(/^£/, '').replace(/,/g, '');

function toRows(lines: MoneyLine[]): Row[] {
  return lines.map((l, i) => ({
    key: i,
    base: { kind: l.kind, priceItemId: l.priceItemId, productId: l.productId },
    description: l.description,
    quantity: String(l.quantity),
    pounds: poundsOf(l.unitPence),
  }));
}

/** The rows as the API takes them, or the first problem in the engineer's words. */
function toInput(rows: Row[]): { lines: MoneyLineInput[] } | { problem: string } {
  if (rows.length === 0) return { problem: 'A quote needs at least one line.' };
  const lines: MoneyLineInput[] = [];
  for (const [i, r] of rows.entries()) {
    const n = i + 1;
    if (!r.description.trim()) return { problem: `Line ${n}: describe the work.` };
    const quantity = Number(r.quantity);
    if (!/^\d+$/.test(r.quantity.trim()) || quantity < 1)
      return { problem: `Line ${n}: the quantity must be 1 or more.` };
    const unitPence = parsePounds(r.pounds);
    if (unitPence === null) return { problem: `Line ${n}: the price must be an amount in pounds, like 12.50.` };
    lines.push({ ...r.base, description: r.description.trim(), quantity, unitPence });
  }
  return { lines };
}

export function QuoteLinesEditor({
  lines,
  vatRegistered,
  busy,
  onSave,
  onCancel,
}: {
  lines: MoneyLine[];
  vatRegistered: boolean;
  busy: boolean;
  onSave: (lines: MoneyLineInput[]) => void;
  onCancel: () => void;
}) {
  const [rows, setRows] = useState<Row[]>(() => toRows(lines));
  const [problem, setProblem] = useState<string | null>(null);
  const set = (key: number, patch: Partial<Row>) =>
    setRows((old) => old.map((r) => (r.key === key ? { ...r, ...patch } : r)));
  return (
    <form
      className="space-y-4"
      onSubmit={(e) => {
        e.preventDefault();
        const answer = toInput(rows);
        if ('problem' in answer) return setProblem(answer.problem);
        setProblem(null);
        onSave(answer.lines);
      }}
    >
      {rows.map((r, i) => (
        <fieldset key={r.key} className="space-y-2 rounded-lg border border-line p-3">
          <legend className="px-1 font-semibold">Line {i + 1}</legend>
          <TextField
            label="Description"
            name={`line-${i}-description`}
            value={r.description}
            maxLength={200}
            onChange={(e) => set(r.key, { description: e.target.value })}
          />
          <div className="grid grid-cols-2 gap-3">
            <TextField
              label="Quantity"
              name={`line-${i}-quantity`}
              inputMode="numeric"
              value={r.quantity}
              onChange={(e) => set(r.key, { quantity: e.target.value })}
            />
            <TextField
              label={vatRegistered ? 'Unit price excl. VAT (£)' : 'Unit price (£)'}
              name={`line-${i}-price`}
              inputMode="decimal"
              value={r.pounds}
              onChange={(e) => set(r.key, { pounds: e.target.value })}
            />
          </div>
          <Button
            variant="quiet"
            className="min-h-12"
            onClick={() => setRows((old) => old.filter((x) => x.key !== r.key))}
          >
            Remove line {i + 1}
          </Button>
        </fieldset>
      ))}
      <Button
        variant="secondary"
        className="min-h-12 w-full"
        onClick={() =>
          setRows((old) => [
            ...old,
            {
              key: Math.max(0, ...old.map((x) => x.key)) + 1,
              base: { kind: 'other' },
              description: '',
              quantity: '1',
              pounds: '',
            },
          ])
        }
      >
        Add a line
      </Button>
      {problem ? (
        <p role="alert" className="font-semibold text-danger-700">
          {problem}
        </p>
      ) : null}
      <div className="flex flex-col gap-3 sm:flex-row">
        <Button type="submit" className="min-h-12 w-full sm:w-auto" busy={busy}>
          Save the lines
        </Button>
        <Button variant="secondary" className="min-h-12 w-full sm:w-auto" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
