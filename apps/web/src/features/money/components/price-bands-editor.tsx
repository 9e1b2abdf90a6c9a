import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import type { FieldErrors } from '@/lib/form';

export interface BandDraft {
  upTo: string;
  price: string;
}

/** A visit's radiator bands: up to N radiators costs £X; bands rise (the domain's bandsProblem says when not). */
export function PriceBandsEditor({
  bands,
  onChange,
  errors,
}: {
  bands: BandDraft[];
  onChange: (bands: BandDraft[]) => void;
  errors: FieldErrors;
}) {
  const set = (i: number, patch: Partial<BandDraft>) =>
    onChange(bands.map((b, j) => (j === i ? { ...b, ...patch } : b)));
  return (
    <fieldset className="space-y-2">
      <legend className="font-semibold">Radiator bands</legend>
      {errors.bands ? <p className="text-sm font-semibold text-danger-700">{errors.bands}</p> : null}
      {bands.map((b, i) => (
        <div key={i} className="grid grid-cols-[1fr_1fr_auto] items-end gap-2">
          <TextField
            label={`Band ${i + 1}: up to radiators`}
            name={`bands.${i}.upToRadiators`}
            inputMode="numeric"
            value={b.upTo}
            onChange={(e) => set(i, { upTo: e.target.value })}
            error={errors[`bands.${i}.upToRadiators`]}
          />
          <TextField
            label="Price (£)"
            name={`bands.${i}.pricePence`}
            inputMode="decimal"
            value={b.price}
            onChange={(e) => set(i, { price: e.target.value })}
            error={errors[`bands.${i}.pricePence`]}
          />
          <Button
            variant="quiet"
            aria-label={`Remove band ${i + 1}`}
            onClick={() => onChange(bands.filter((_, j) => j !== i))}
          >
            Remove
          </Button>
        </div>
      ))}
      <Button variant="secondary" onClick={() => onChange([...bands, { upTo: '', price: '' }])}>
        Add a band
      </Button>
    </fieldset>
  );
}
