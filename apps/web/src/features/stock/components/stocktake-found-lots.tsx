import type { Product } from '@heatfleet/domain';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';

const foundLineFields = ['productId', 'lotNumber', 'expiresOn', 'counted'] as const;

export function foundFields(keys: number[]): string[] {
  return keys.flatMap((_, i) => foundLineFields.map((f) => `found.${i}.${f}`));
}

export function prepareFound(keys: number[], values: Record<string, string | undefined>) {
  return keys.map((_, i) => ({
    productId: values[`found.${i}.productId`] ? Number(values[`found.${i}.productId`]) : undefined,
    lotNumber: values[`found.${i}.lotNumber`] ?? '',
    expiresOn: values[`found.${i}.expiresOn`] || undefined,
    counted: values[`found.${i}.counted`] ? Number(values[`found.${i}.counted`]) : undefined,
  }));
}

/** Stock found on the shelf that is not on record here: product, lot, use-by date and packs. */
export function FoundLotRows({
  keys,
  setKeys,
  products,
  errors,
}: {
  keys: number[];
  setKeys: (update: (keys: number[]) => number[]) => void;
  products: Product[];
  errors: Record<string, string | undefined>;
}) {
  const options = [
    { value: '', label: 'Choose a product…' },
    ...products.map((p) => ({ value: String(p.id), label: p.name })),
  ];
  return (
    <div className="space-y-3">
      {keys.length > 0 ? (
        <ol className="space-y-3" aria-label="Found lots">
          {keys.map((key, i) => (
            <li key={key} className="rounded-lg border border-line bg-canvas p-3">
              <fieldset className="grid gap-3 sm:grid-cols-[2fr_1fr_1fr_1fr]">
                <legend className="mb-1 font-semibold">Found lot {i + 1}</legend>
                <SelectField
                  label="Product"
                  name={`found.${i}.productId`}
                  defaultValue=""
                  options={options}
                  error={errors[`found.${i}.productId`]}
                />
                <TextField
                  label="Lot number"
                  name={`found.${i}.lotNumber`}
                  maxLength={60}
                  autoComplete="off"
                  error={errors[`found.${i}.lotNumber`]}
                />
                <TextField
                  label="Use by"
                  name={`found.${i}.expiresOn`}
                  type="date"
                  error={errors[`found.${i}.expiresOn`]}
                />
                <TextField
                  label="Packs found"
                  name={`found.${i}.counted`}
                  type="number"
                  inputMode="numeric"
                  min={1}
                  step={1}
                  error={errors[`found.${i}.counted`]}
                />
              </fieldset>
              <Button
                variant="quiet"
                className="mt-1 px-0"
                onClick={() => setKeys((ks) => ks.filter((k) => k !== key))}
              >
                Remove found lot {i + 1}
              </Button>
            </li>
          ))}
        </ol>
      ) : null}
      <Button variant="secondary" onClick={() => setKeys((ks) => [...ks, (ks.at(-1) ?? 0) + 1])}>
        Add a found lot
      </Button>
    </div>
  );
}
