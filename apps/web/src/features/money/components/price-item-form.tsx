import { useState, type FormEvent } from 'react';
import {
  parsePounds,
  priceItemInputSchema,
  priceVisitKindLabels,
  priceVisitKinds,
  type PriceItem,
  type PriceItemKind,
} from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { isApiError } from '@/lib/api-client';
import { firstErrorPerField, type FieldErrors } from '@/lib/form';
import { penceToPoundsText, useSavePriceItem } from '../api/price-invoice-actions';
import { PriceBandsEditor, type BandDraft } from './price-bands-editor';

const kindOptions = [
  { value: 'visit', label: 'Visit' },
  { value: 'chemical', label: 'Chemical' },
  { value: 'extra', label: 'Extra' },
];
const pricingOptions = [
  { value: 'per_radiator', label: 'Base + per radiator' },
  { value: 'bands', label: 'Radiator bands' },
];
const money = (p: number | undefined) => (p === undefined ? '' : penceToPoundsText(p));
/** Typed pounds to pence with the domain's exact parser; what is not money stays text, so the schema says why. */
const pence = (text: string): number | string | undefined =>
  text.trim() === '' ? undefined : (parsePounds(text) ?? text);

/** Add or change one price: a visit (base + per radiator, or bands), a chemical (a stock product) or an extra. */
export interface ProductChoice {
  id: number;
  name: string;
}

export function PriceItemForm({
  item,
  products,
  onDone,
}: {
  item: PriceItem | null;
  products: readonly ProductChoice[];
  onDone: () => void;
}) {
  const save = useSavePriceItem();
  const [kind, setKind] = useState<PriceItemKind>(item?.kind ?? 'visit');
  const [name, setName] = useState(item?.name ?? '');
  const [visitKind, setVisitKind] = useState<string>(item?.visitKind ?? 'full_clean');
  const [pricing, setPricing] = useState<string>(item?.pricing ?? 'per_radiator');
  const [base, setBase] = useState(money(item?.basePence));
  const [perRadiator, setPerRadiator] = useState(money(item?.perRadiatorPence));
  const [unit, setUnit] = useState(money(item?.unitPence));
  const [productId, setProductId] = useState(item?.productId ? String(item.productId) : '');
  const [bands, setBands] = useState<BandDraft[]>(
    (item?.bands ?? []).map((b) => ({ upTo: String(b.upToRadiators), price: money(b.pricePence) })),
  );
  const [errors, setErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);

  function submit(event: FormEvent) {
    event.preventDefault();
    const raw = {
      kind,
      name,
      visitKind: kind === 'visit' ? visitKind : null,
      pricing: kind === 'visit' ? pricing : null,
      basePence: kind === 'visit' ? pence(base) : 0,
      perRadiatorPence: kind === 'visit' ? pence(perRadiator) : 0,
      bands:
        kind === 'visit' && pricing === 'bands'
          ? bands.map((b) => ({
              upToRadiators: /^\d+$/.test(b.upTo) ? Number(b.upTo) : b.upTo,
              pricePence: pence(b.price),
            }))
          : [],
      productId: kind === 'chemical' && productId ? Number(productId) : null,
      unitPence: kind === 'visit' ? 0 : pence(unit),
      active: item?.active ?? true,
    };
    const parsed = priceItemInputSchema.safeParse(raw);
    if (!parsed.success) {
      setErrors(firstErrorPerField(parsed.error.issues));
      return;
    }
    setErrors({});
    setFormError(null);
    save.mutate(
      { id: item?.id ?? null, input: parsed.data },
      {
        onSuccess: onDone,
        onError: (error) => {
          if (isApiError(error)) setErrors(firstErrorPerField(error.details));
          setFormError(error instanceof Error ? error.message : 'The price was not saved. Please try again.');
        },
      },
    );
  }

  const productOptions = [
    { value: '', label: 'Choose a product' },
    ...products.map((p) => ({ value: String(p.id), label: p.name })),
  ];
  return (
    <form noValidate aria-label={item ? `Change ${item.name}` : 'New price'} className="space-y-3" onSubmit={submit}>
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <div className="grid gap-3 sm:grid-cols-2">
        <SelectField
          label="Kind"
          value={kind}
          onChange={(e) => setKind(e.target.value as PriceItemKind)}
          options={kindOptions}
          error={errors.kind}
        />
        <TextField
          label="Name"
          name="name"
          value={name}
          onChange={(e) => setName(e.target.value)}
          error={errors.name}
        />
      </div>
      {kind === 'visit' ? (
        <>
          <div className="grid gap-3 sm:grid-cols-2">
            <SelectField
              label="Visit"
              value={visitKind}
              onChange={(e) => setVisitKind(e.target.value)}
              options={priceVisitKinds.map((k) => ({ value: k, label: priceVisitKindLabels[k] }))}
              error={errors.visitKind}
            />
            <SelectField
              label="Priced by"
              value={pricing}
              onChange={(e) => setPricing(e.target.value)}
              options={pricingOptions}
              error={errors.pricing}
            />
            {pricing === 'per_radiator' ? (
              <TextField
                label="Base price (£)"
                name="basePence"
                inputMode="decimal"
                value={base}
                onChange={(e) => setBase(e.target.value)}
                error={errors.basePence}
              />
            ) : null}
            <TextField
              label={pricing === 'bands' ? 'Per radiator above the last band (£)' : 'Per radiator (£)'}
              name="perRadiatorPence"
              inputMode="decimal"
              value={perRadiator}
              onChange={(e) => setPerRadiator(e.target.value)}
              error={errors.perRadiatorPence}
            />
          </div>
          {pricing === 'bands' ? <PriceBandsEditor bands={bands} onChange={setBands} errors={errors} /> : null}
        </>
      ) : (
        <div className="grid gap-3 sm:grid-cols-2">
          {kind === 'chemical' ? (
            <SelectField
              label="Stock product"
              value={productId}
              onChange={(e) => setProductId(e.target.value)}
              options={productOptions}
              error={errors.productId}
            />
          ) : null}
          <TextField
            label="Price each (£, before VAT)"
            name="unitPence"
            inputMode="decimal"
            value={unit}
            onChange={(e) => setUnit(e.target.value)}
            error={errors.unitPence}
          />
        </div>
      )}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" busy={save.isPending}>
          {item ? 'Save price' : 'Add price'}
        </Button>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
