import {
  waterTestFigures,
  waterTestsInputSchema,
  type JobSheet,
  type WaterTestFigures,
  type WaterTestsInput,
} from '@heatfleet/domain';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { NumberField } from '@/components/ui/number-field';
import { SelectField } from '@/components/ui/select-field';
import type { Parsed } from '@/features/jobs/api/autosave-store';
import { useSheetPut } from '@/features/jobs/api/use-job-sheet-mutations';
import { useAutosave } from '@/features/jobs/components/autosave-context';
import { JudgementNote } from '@/features/jobs/components/job-cautions';
import { SavedMark } from '@/features/jobs/components/saved-mark';
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

function parseWater(draft: WaterDraft): Parsed<WaterTestsInput> {
  const values = {
    mainsTdsPpm: decimalOrNull(draft.mainsTdsPpm),
    systemTdsPpm: decimalOrNull(draft.systemTdsPpm),
    waterClear: draft.waterClear === '' ? null : draft.waterClear === 'yes',
    inhibitorProductId: draft.inhibitorProductId ? Number(draft.inhibitorProductId) : null,
    inhibitorReading: decimalOrNull(draft.inhibitorReading),
    ph: decimalOrNull(draft.ph),
  };
  const parsed = waterTestsInputSchema.safeParse(values);
  if (parsed.success) return { ok: true, input: parsed.data };
  const errors: Record<string, string> = {};
  for (const issue of parsed.error.issues) errors[String(issue.path[0])] ??= issue.message;
  return { ok: false, empty: false, errors };
}

/**
 * The flush and inhibitor tests: each box saves the set on its own (one PUT of the whole set, so a
 * repeat is harmless); the verdicts appear as the figures are typed.
 */
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
  const put = useSheetPut(jobId);
  const { water } = sheet;
  const slot = useAutosave('water', () => waterDraft(water, defaultInhibitorId), {
    label: 'Water tests',
    parse: parseWater,
    send: (input: WaterTestsInput) => put('/water-tests', input),
    savedInput: {
      mainsTdsPpm: water.mainsTdsPpm,
      systemTdsPpm: water.systemTdsPpm,
      waterClear: water.waterClear,
      inhibitorProductId: water.inhibitorProductId,
      inhibitorReading: water.inhibitorReading,
      ph: water.ph,
    },
  });
  const draft = slot.draft;
  // The set always exists on the API; the mark says "saved" once something in it was.
  const tested = [water.mainsTdsPpm, water.systemTdsPpm, water.waterClear, water.inhibitorReading, water.ph].some(
    (v) => v !== null,
  );
  const set = (patch: Partial<WaterDraft>, now = false) => {
    slot.edit({ ...draft, ...patch });
    if (now) void slot.flush();
  };
  const product = inhibitors.find((p) => String(p.id) === draft.inhibitorProductId);
  const range = rangeOf(product);
  const figures = waterTestFigures(
    {
      mainsTdsPpm: finiteOrNull(draft.mainsTdsPpm),
      systemTdsPpm: finiteOrNull(draft.systemTdsPpm),
      waterClear: draft.waterClear === '' ? null : draft.waterClear === 'yes',
      inhibitorReading: finiteOrNull(draft.inhibitorReading),
    },
    range,
  );
  const unit = range?.unit ? ` (${range.unit})` : '';
  const box = (key: 'mainsTdsPpm' | 'systemTdsPpm' | 'inhibitorReading' | 'ph', label: string) => (
    <NumberField
      label={label}
      name={key}
      value={draft[key]}
      onValueChange={(value) => set({ [key]: value })}
      onEnter={() => void slot.flush()}
      onBlur={() => void slot.flush()}
      error={slot.errors[key]}
      disabled={!sheet.editable}
    />
  );
  return (
    <div role="group" aria-label="Water tests" data-field-scope="" className="space-y-4">
      <div className="flex justify-end">
        <SavedMark
          status={slot.status}
          kept={slot.kept}
          stored={tested || slot.savedAt !== null}
          failure={slot.failure}
          onRetry={() => void slot.flush()}
        />
      </div>
      <fieldset disabled={!sheet.editable} className="space-y-4">
        <ChoiceGroup
          legend="Water runs clear?"
          name={`water-clear-${jobId}`}
          columns={2}
          value={draft.waterClear}
          onChange={(value) => set({ waterClear: value as WaterDraft['waterClear'] }, true)}
          options={[
            { value: 'yes', label: 'Yes, clear' },
            { value: 'no', label: 'No, still dirty' },
          ]}
          error={slot.errors.waterClear}
        />
        <div className="grid grid-cols-2 gap-3">
          {box('mainsTdsPpm', 'Mains TDS (ppm)')}
          {box('systemTdsPpm', 'System TDS (ppm)')}
        </div>
        <p className="text-sm text-ink-muted">System TDS after the final flush, before the inhibitor goes in.</p>
        <FlushResult flush={figures.flush} waterClear={draft.waterClear} />
        <SelectField
          label="Inhibitor"
          className="[&_select]:min-h-12"
          value={draft.inhibitorProductId}
          onChange={(e) => set({ inhibitorProductId: e.target.value }, true)}
          options={[
            { value: '', label: 'Choose the inhibitor' },
            ...inhibitors.map((p) => ({ value: String(p.id), label: p.name })),
          ]}
          error={slot.errors.inhibitorProductId}
        />
        <div className="grid grid-cols-2 gap-3">
          {box('inhibitorReading', `Inhibitor reading${unit}`)}
          {box('ph', 'pH, if taken')}
        </div>
        <InhibitorResult figures={figures.inhibitor} range={range} hasReading={draft.inhibitorReading.trim() !== ''} />
      </fieldset>
      <JudgementNote />
    </div>
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
