import { useState } from 'react';
import {
  packSizeInUnit,
  packSizeMl,
  productInputSchema,
  productKindLabels,
  productKinds,
  type PackUnit,
  type Product,
} from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { SelectField } from '@/components/ui/select-field';
import { TextareaField } from '@/components/ui/textarea-field';
import { TextField } from '@/components/ui/text-field';
import { useSchemaForm } from '@/lib/form';
import { useCreateProduct, useUpdateProduct } from '@/features/stock/api/use-save-product';
import { GallonsToggle, packSizeText } from '@/features/stock/components/pack-size';

const fields = [
  'name',
  'kind',
  'ownKind',
  'packSize',
  'packUnit',
  'doseLitresPer100L',
  'radiatorsPerPack',
  'targetMin',
  'targetMax',
  'targetUnit',
  'testMethod',
  'shelfLifeMonths',
  'hazardNotes',
  'minCirculationMinutes',
  'minShelfLifeDays',
  'supplierCode',
  'costPricePence',
] as const;

const numberOrNull = (value: string | undefined) => (value === undefined || value.trim() === '' ? null : Number(value));

function prepare(values: Record<string, string | undefined>) {
  return {
    name: values.name ?? '',
    kind: values.kind,
    ownKind: values.ownKind ?? '',
    packSize: values.packSize?.trim() ? Number(values.packSize) : undefined,
    packUnit: values.packUnit,
    doseLitresPer100L: numberOrNull(values.doseLitresPer100L),
    radiatorsPerPack: numberOrNull(values.radiatorsPerPack),
    targetMin: numberOrNull(values.targetMin),
    targetMax: numberOrNull(values.targetMax),
    targetUnit: values.targetUnit ?? '',
    testMethod: values.testMethod ?? '',
    shelfLifeMonths: numberOrNull(values.shelfLifeMonths),
    hazardNotes: values.hazardNotes ?? '',
    ...(values.minShelfLifeDays?.trim() ? { minShelfLifeDays: Number(values.minShelfLifeDays) } : {}),
    supplierCode: values.supplierCode ?? '',
    costPricePence: numberOrNull(values.costPricePence),
    // Only a cleaner shows the field; for other kinds it is left out and keeps what is stored.
    ...(values.minCirculationMinutes === undefined
      ? {}
      : { minCirculationMinutes: numberOrNull(values.minCirculationMinutes) }),
  };
}

const str = (n: number | null | undefined) => (n === null || n === undefined ? '' : String(n));

export function ProductForm({ product, onSaved }: { product?: Product; onSaved?: (product: Product) => void }) {
  const create = useCreateProduct();
  const update = useUpdateProduct();
  const form = useSchemaForm(productInputSchema, fields, prepare);
  const initialPack = product ? packSizeInUnit(product.packSizeMl) : null;
  const [packSize, setPackSize] = useState(initialPack ? String(initialPack.size) : '');
  const [packUnit, setPackUnit] = useState<PackUnit>(initialPack?.unit ?? 'l');
  const [showGallons, setShowGallons] = useState(false);
  const [kind, setKind] = useState<string>(product?.kind ?? '');
  const [saved, setSaved] = useState<string | null>(null);
  const pending = create.isPending || update.isPending;
  const sizeNumber = Number(packSize);
  const previewMl =
    packSize.trim() && Number.isFinite(sizeNumber) && sizeNumber > 0 ? packSizeMl(sizeNumber, packUnit) : null;

  return (
    <form
      ref={form.formRef}
      noValidate
      aria-label={product ? 'Change product' : 'New product'}
      className="space-y-4"
      onSubmit={form.handleSubmit((input) => {
        setSaved(null);
        const options = {
          onSuccess: (saved: Product) => {
            setSaved(product ? `Saved ${saved.name}.` : `Added ${saved.name}.`);
            if (!product) {
              form.formRef.current?.reset();
              setPackSize('');
              setKind('');
            }
            onSaved?.(saved);
          },
          onError: form.showError,
        };
        if (product) update.mutate({ id: product.id, input }, options);
        else create.mutate(input, options);
      })}
    >
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          label="Name"
          name="name"
          maxLength={120}
          defaultValue={product?.name ?? ''}
          error={form.fieldErrors.name}
        />
        <SelectField
          label="Kind"
          name="kind"
          value={kind}
          onChange={(event) => setKind(event.target.value)}
          options={[
            { value: '', label: 'Choose a kind…' },
            ...productKinds.map((k) => ({ value: k, label: productKindLabels[k] })),
          ]}
          error={form.fieldErrors.kind}
        />
        <TextField
          label="Your own kind (when the kind is Other)"
          name="ownKind"
          maxLength={40}
          defaultValue={product?.ownKind ?? ''}
          error={form.fieldErrors.ownKind}
        />
      </div>
      <fieldset className="grid gap-4 rounded-lg border border-line p-3 sm:grid-cols-2">
        <legend className="px-1 font-semibold">Pack size</legend>
        <TextField
          label="Size of one pack"
          name="packSize"
          type="number"
          inputMode="decimal"
          min={0}
          step="any"
          value={packSize}
          onChange={(event) => setPackSize(event.target.value)}
          error={form.fieldErrors.packSize}
          hint={previewMl !== null ? `That is ${packSizeText(previewMl, showGallons)}.` : undefined}
        />
        <ChoiceGroup
          legend="Measured in"
          name="packUnit"
          columns={2}
          value={packUnit}
          onChange={(value) => setPackUnit(value === 'ml' ? 'ml' : 'l')}
          options={[
            { value: 'l', label: 'Litres (L)' },
            { value: 'ml', label: 'Millilitres (ml)' },
          ]}
          error={form.fieldErrors.packUnit}
        />
        <div className="sm:col-span-2">
          <GallonsToggle checked={showGallons} onChange={setShowGallons} />
        </div>
      </fieldset>
      <fieldset className="grid gap-4 rounded-lg border border-line p-3 sm:grid-cols-2">
        <legend className="px-1 font-semibold">Dose rule</legend>
        <TextField
          label="Litres of product per 100 L of system water"
          name="doseLitresPer100L"
          type="number"
          inputMode="decimal"
          min={0}
          step="any"
          defaultValue={str(product?.doseLitresPer100L)}
          error={form.fieldErrors.doseLitresPer100L}
        />
        <TextField
          label="Or one pack per this many radiators (optional)"
          name="radiatorsPerPack"
          type="number"
          inputMode="numeric"
          min={1}
          step={1}
          defaultValue={str(product?.radiatorsPerPack)}
          error={form.fieldErrors.radiatorsPerPack}
        />
      </fieldset>
      <fieldset className="grid gap-4 rounded-lg border border-line p-3 sm:grid-cols-3">
        <legend className="px-1 font-semibold">Target concentration in the system</legend>
        <TextField
          label="From"
          name="targetMin"
          type="number"
          inputMode="decimal"
          step="any"
          defaultValue={str(product?.targetMin)}
          error={form.fieldErrors.targetMin}
        />
        <TextField
          label="To"
          name="targetMax"
          type="number"
          inputMode="decimal"
          step="any"
          defaultValue={str(product?.targetMax)}
          error={form.fieldErrors.targetMax}
        />
        <TextField
          label="Unit (e.g. % v/v, ppm)"
          name="targetUnit"
          maxLength={20}
          defaultValue={product?.targetUnit ?? ''}
          error={form.fieldErrors.targetUnit}
        />
        <TextField
          label="How it is tested"
          name="testMethod"
          maxLength={300}
          className="sm:col-span-3"
          defaultValue={product?.testMethod ?? ''}
          error={form.fieldErrors.testMethod}
        />
      </fieldset>
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          label="Shelf life (months)"
          name="shelfLifeMonths"
          type="number"
          inputMode="numeric"
          min={1}
          step={1}
          defaultValue={str(product?.shelfLifeMonths)}
          error={form.fieldErrors.shelfLifeMonths}
        />
        {kind === 'cleaner' ? (
          <TextField
            label="Minimum circulation time (minutes)"
            name="minCirculationMinutes"
            type="number"
            inputMode="numeric"
            min={1}
            step={1}
            hint="From the cleaner’s label: how long it must circulate hot. The job sheet times against it."
            defaultValue={str(product?.minCirculationMinutes)}
            error={form.fieldErrors.minCirculationMinutes}
          />
        ) : null}
        <TextField
          label="Minimum remaining life at receiving (days)"
          name="minShelfLifeDays"
          type="number"
          inputMode="numeric"
          min={0}
          step={1}
          hint="A delivered lot with less use left asks for a confirm. 90 days unless you change it."
          defaultValue={str(product?.minShelfLifeDays ?? 90)}
          error={form.fieldErrors.minShelfLifeDays}
        />
        <TextField
          label="Supplier code (optional)"
          name="supplierCode"
          maxLength={60}
          autoComplete="off"
          defaultValue={product?.supplierCode ?? ''}
          error={form.fieldErrors.supplierCode}
        />
        <TextField
          label="Cost price per pack, in pence (optional)"
          name="costPricePence"
          type="number"
          inputMode="numeric"
          min={0}
          step={1}
          hint="Whole pence: 1250 is £12.50. The reorder list adds it up."
          defaultValue={str(product?.costPricePence)}
          error={form.fieldErrors.costPricePence}
        />
      </div>
      <TextareaField
        label="Hazard notes"
        name="hazardNotes"
        rows={3}
        maxLength={2000}
        defaultValue={product?.hazardNotes ?? ''}
        error={form.fieldErrors.hazardNotes}
      />
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      {saved ? <Alert tone="success">{saved}</Alert> : null}
      <Button type="submit" busy={pending} className="min-h-14 w-full text-lg sm:w-auto sm:min-w-48">
        {product ? 'Save changes' : 'Add product'}
      </Button>
    </form>
  );
}
