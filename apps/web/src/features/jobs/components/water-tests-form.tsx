import { useState, type FormEvent } from 'react';
import { waterTestFigures, waterTestsInputSchema, type WaterTestFigures, type JobSheet } from '@heatfleet/domain';
import { Button } from '@/components/ui/button';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { firstErrorPerField, type FieldErrors } from '@/lib/form';
import { useSaveWaterTests } from '@/features/jobs/api/use-job-sheet-mutations';
import { JudgementNote } from '@/features/jobs/components/job-cautions';
import { SaveFeedback } from '@/features/jobs/components/save-feedback';
import { decimalOrNull, finiteOrNull, numberText } from '@/features/jobs/components/sheet-format';

/** An inhibitor the firm stocks, with the range its label gives for a correct dose. */
export interface InhibitorChoice {
  id: number;
  name: string;
  targetMin: number | null;
  targetMax: number | null;
  targetUnit: string | null;
}

interface WaterDraft {
  mainsTdsPpm: string;
  systemTdsPpm: string;
  waterClear: '' | 'yes' | 'no';
  inhibitorProductId: string;
  inhibitorReading: string;
  ph: string;
}

function waterDraft(water: JobSheet['water'], defaultInhibitorId: number | null): WaterDraft {
  const productId = water.inhibitorProductId ?? defaultInhibitorId;
  return {
    mainsTdsPpm: numberText(water.mainsTdsPpm),
    systemTdsPpm: numberText(water.systemTdsPpm),
    waterClear: water.waterClear === null ? '' : water.waterClear ? 'yes' : 'no',
    inhibitorProductId: productId ? String(productId) : '',
    inhibitorReading: numberText(water.inhibitorReading),
    ph: numberText(water.ph),
  };
}

function rangeOf(product: InhibitorChoice | undefined) {
  return product && product.targetMin !== null && product.targetMax !== null
    ? { min: product.targetMin, max: product.targetMax, unit: product.targetUnit }
    : null;
}

function percent(n: number): string {
  return Number.isFinite(n) ? `${n}%` : 'too far';
}

function FlushResult({
  flush,
  waterClear,
}: {
  flush: WaterTestFigures['flush'];
  waterClear: WaterDraft['waterClear'];
}) {
  if (!flush) return <p className="text-ink-muted">Enter the mains and system TDS to check the flush.</p>;
  if (flush.complete)
    return (
      <p className="rounded-md border-l-4 border-ok-700 bg-ok-50 px-3 py-2 font-semibold text-ok-700">
        Flush complete: system water within {percent(flush.withinPercent)} of mains, and clear.
      </p>
    );
  const tdsOk = flush.withinPercent <= 10;
  return (
    <p className="rounded-md border-l-4 border-ember-500 bg-ember-100 px-3 py-2 font-semibold text-ember-700">
      {tdsOk
        ? `Not yet: TDS is within ${percent(flush.withinPercent)} of mains, but the water must run clear${waterClear === '' ? ' (say whether it does)' : ''}.`
        : `Not yet: ${percent(flush.withinPercent)} from mains. Keep flushing until within 10%.`}
    </p>
  );
}

function InhibitorResult({
  figures,
  range,
  hasReading,
}: {
  figures: WaterTestFigures['inhibitor'];
  range: ReturnType<typeof rangeOf>;
  hasReading: boolean;
}) {
  if (!range) return <p className="text-ink-muted">Choose an inhibitor with a target range to check the reading.</p>;
  const target = `target ${range.min} to ${range.max}${range.unit ? ` ${range.unit}` : ''}`;
  if (!figures || !hasReading) return <p className="text-ink-muted">Enter the reading after dosing: {target}.</p>;
  const tone =
    figures.result === 'pass'
      ? 'border-ok-700 bg-ok-50 text-ok-700'
      : figures.result === 'low'
        ? 'border-danger-700 bg-danger-50 text-danger-700'
        : 'border-ember-500 bg-ember-100 text-ember-700';
  const words = {
    pass: 'Inhibitor pass',
    low: 'Inhibitor low: dose more and test again',
    high: 'Inhibitor high: above the range',
  }[figures.result];
  return <p className={`rounded-md border-l-4 px-3 py-2 font-semibold ${tone}`}>{`${words} (${target}).`}</p>;
}

export function WaterTestsForm({
  jobId,
  sheet,
  inhibitors,
  defaultInhibitorId,
}: {
  jobId: number;
  sheet: JobSheet;
  inhibitors: InhibitorChoice[];
  defaultInhibitorId: number | null;
}) {
  const savedDraft = waterDraft(sheet.water, defaultInhibitorId);
  const [draft, setDraft] = useState<WaterDraft>(savedDraft);
  const [errors, setErrors] = useState<FieldErrors>({});
  const save = useSaveWaterTests(jobId);
  const set = (patch: Partial<WaterDraft>) => {
    save.reset();
    setDraft((d) => ({ ...d, ...patch }));
  };
  const product = inhibitors.find((p) => String(p.id) === draft.inhibitorProductId);
  const range = rangeOf(product);
  const dirty = JSON.stringify(draft) !== JSON.stringify(savedDraft);
  const live = waterTestFigures(
    {
      mainsTdsPpm: finiteOrNull(draft.mainsTdsPpm),
      systemTdsPpm: finiteOrNull(draft.systemTdsPpm),
      waterClear: draft.waterClear === '' ? null : draft.waterClear === 'yes',
      inhibitorReading: finiteOrNull(draft.inhibitorReading),
    },
    range,
  );
  // Saved and unchanged: the API's figures are the record.
  const figures = dirty ? live : sheet.water.figures;

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const parsed = waterTestsInputSchema.safeParse({
      mainsTdsPpm: decimalOrNull(draft.mainsTdsPpm),
      systemTdsPpm: decimalOrNull(draft.systemTdsPpm),
      waterClear: draft.waterClear === '' ? null : draft.waterClear === 'yes',
      inhibitorProductId: draft.inhibitorProductId ? Number(draft.inhibitorProductId) : null,
      inhibitorReading: decimalOrNull(draft.inhibitorReading),
      ph: decimalOrNull(draft.ph),
    });
    if (!parsed.success) {
      setErrors(firstErrorPerField(parsed.error.issues));
      return;
    }
    setErrors({});
    save.mutate(parsed.data, { onSuccess: (next) => setDraft(waterDraft(next.water, defaultInhibitorId)) });
  };

  const unit = range?.unit ? ` (${range.unit})` : '';
  return (
    <form aria-label="Water tests" noValidate onSubmit={submit} className="space-y-4">
      <JudgementNote />
      <fieldset disabled={!sheet.editable} className="space-y-4">
        <div className="grid grid-cols-2 gap-3">
          <TextField
            label="Mains TDS (ppm)"
            name="mainsTdsPpm"
            inputMode="decimal"
            autoComplete="off"
            value={draft.mainsTdsPpm}
            onChange={(e) => set({ mainsTdsPpm: e.target.value })}
            error={errors.mainsTdsPpm}
          />
          <TextField
            label="System TDS (ppm)"
            name="systemTdsPpm"
            inputMode="decimal"
            autoComplete="off"
            value={draft.systemTdsPpm}
            onChange={(e) => set({ systemTdsPpm: e.target.value })}
            error={errors.systemTdsPpm}
          />
        </div>
        <p className="text-sm text-ink-muted">System TDS after the final flush, before the inhibitor goes in.</p>
        <ChoiceGroup
          legend="Water runs clear?"
          name={`water-clear-${jobId}`}
          columns={2}
          value={draft.waterClear}
          onChange={(value) => set({ waterClear: value as WaterDraft['waterClear'] })}
          options={[
            { value: 'yes', label: 'Yes, clear' },
            { value: 'no', label: 'No, still dirty' },
          ]}
          error={errors.waterClear}
        />
        <FlushResult flush={figures.flush} waterClear={draft.waterClear} />
        <SelectField
          label="Inhibitor"
          value={draft.inhibitorProductId}
          onChange={(e) => set({ inhibitorProductId: e.target.value })}
          options={[
            { value: '', label: 'Choose the inhibitor' },
            ...inhibitors.map((p) => ({ value: String(p.id), label: p.name })),
          ]}
          error={errors.inhibitorProductId}
        />
        <div className="grid gap-3 sm:grid-cols-2">
          <TextField
            label={`Inhibitor reading${unit}`}
            name="inhibitorReading"
            inputMode="decimal"
            autoComplete="off"
            value={draft.inhibitorReading}
            onChange={(e) => set({ inhibitorReading: e.target.value })}
            error={errors.inhibitorReading}
          />
          <TextField
            label="pH, if taken"
            name="ph"
            inputMode="decimal"
            autoComplete="off"
            value={draft.ph}
            onChange={(e) => set({ ph: e.target.value })}
            error={errors.ph}
          />
        </div>
        <InhibitorResult figures={figures.inhibitor} range={range} hasReading={draft.inhibitorReading.trim() !== ''} />
      </fieldset>
      {sheet.editable ? (
        <>
          <SaveFeedback error={save.error} saved={save.isSuccess && !dirty} />
          <Button type="submit" variant="secondary" className="min-h-12 w-full sm:w-auto" busy={save.isPending}>
            Save the water tests
          </Button>
        </>
      ) : null}
    </form>
  );
}

export function waterSummary(sheet: JobSheet): string {
  const { flush, inhibitor } = sheet.water.figures;
  const parts = [
    flush ? (flush.complete ? 'flush complete' : 'flush not complete') : null,
    inhibitor ? `inhibitor ${inhibitor.result}` : null,
  ].filter(Boolean);
  return parts.length ? parts.join(' · ') : 'Not tested yet';
}
