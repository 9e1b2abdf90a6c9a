import {
  radiatorReadingInputSchema,
  readingFigures,
  type JobSheet,
  type RadiatorReadingInput,
  type ReadingFigures,
  type ReadingPhase,
  type SavedReading,
  type SheetRadiator,
} from '@heatfleet/domain';
import { Badge } from '@/components/ui/badge';
import { NumberField } from '@/components/ui/number-field';
import type { Parsed } from '@/features/jobs/api/autosave-store';
import { useSheetPut } from '@/features/jobs/api/use-job-sheet-mutations';
import { useAutosave } from '@/features/jobs/components/autosave-context';
import { SavedMark } from '@/features/jobs/components/saved-mark';
import { decimalOrNull, numberText } from '@/features/jobs/components/sheet-format';

type Key = keyof RadiatorReadingInput;
type ReadingDraft = Record<Key, string>;

export const watts = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 0 });

function draftOf(saved: SavedReading | null): ReadingDraft {
  return {
    topC: numberText(saved?.topC),
    bottomC: numberText(saved?.bottomC),
    flowC: numberText(saved?.flowC),
    returnC: numberText(saved?.returnC),
    roomC: numberText(saved?.roomC),
  };
}

function inputOf(saved: SavedReading): RadiatorReadingInput {
  return { topC: saved.topC, bottomC: saved.bottomC, flowC: saved.flowC, returnC: saved.returnC, roomC: saved.roomC };
}

/** Saved once both the top and the bottom are valid numbers; the optional three go with them. */
export function parseReading(draft: ReadingDraft): Parsed<RadiatorReadingInput> {
  const values = {
    topC: decimalOrNull(draft.topC),
    bottomC: decimalOrNull(draft.bottomC),
    flowC: decimalOrNull(draft.flowC),
    returnC: decimalOrNull(draft.returnC),
    roomC: decimalOrNull(draft.roomC),
  };
  const parsed = radiatorReadingInputSchema.safeParse(values);
  if (parsed.success) return { ok: true, input: parsed.data };
  const errors: Record<string, string> = {};
  for (const issue of parsed.error.issues) {
    const key = issue.path[0] as Key;
    // A box not filled in yet is incomplete, not wrong: only a figure typed can be refused.
    if (values[key] !== null && !errors[key]) errors[key] = issue.message;
  }
  return { ok: false, empty: Object.values(values).every((v) => v === null), errors };
}

function FiguresLine({
  figures,
  ratedWatts,
  roomTaken,
}: {
  figures: ReadingFigures | null;
  ratedWatts: number | null;
  roomTaken: boolean;
}) {
  if (!figures) return null;
  return (
    <div className="space-y-1 rounded-md bg-canvas px-3 py-2">
      <p className="flex flex-wrap items-center gap-2">
        <span className="font-semibold tabular-nums">Top to bottom {figures.differenceK} K</span>
        {figures.coldBottom ? <Badge tone="danger">Cold bottom</Badge> : <Badge tone="ok">No cold bottom</Badge>}
      </p>
      <p className="text-sm tabular-nums">
        Mean water to room {figures.deltaTK} K{' '}
        <span className="text-ink-muted">
          ({figures.deltaTFrom === 'flow_return' ? 'from flow and return' : 'from the surfaces'}, room{' '}
          {figures.roomUsedC} °C{roomTaken ? '' : ' (not taken: the rating room)'})
        </span>
      </p>
      {figures.outputWatts !== null && ratedWatts !== null ? (
        <p className="text-sm tabular-nums">
          Output about {watts.format(figures.outputWatts)} W of {watts.format(ratedWatts)} W rated (EN 442)
        </p>
      ) : null}
    </div>
  );
}

/** "62/38 °C, cold bottom": a saved reading on one line, for the folded card and the list. */
export function readingSummary(r: SavedReading | null): string {
  if (!r) return 'not taken';
  return `${r.topC}/${r.bottomC} °C${r.coldBottom ? ', cold bottom' : ''}`;
}

/**
 * One radiator's top and bottom temperatures before or after the clean, on the number keypad; Enter
 * moves from top to bottom and on. Saved as soon as both are valid; flow, return and room fold away.
 */
export function ReadingFields({
  jobId,
  radiator,
  phase,
  sheet,
  name,
}: {
  jobId: number;
  radiator: SheetRadiator;
  phase: ReadingPhase;
  sheet: JobSheet;
  name: string;
}) {
  const put = useSheetPut(jobId);
  const saved = radiator[phase];
  const slot = useAutosave(`reading:${radiator.index}:${phase}`, () => draftOf(saved), {
    label: `${name}: ${phase} reading`,
    parse: parseReading,
    send: (input: RadiatorReadingInput) => put(`/radiators/${radiator.index}/readings/${phase}`, input),
    savedInput: saved ? inputOf(saved) : null,
  });
  const parsed = parseReading(slot.draft);
  const live = parsed.ok ? readingFigures(parsed.input, radiator.ratedWatts, sheet.coldBottomThresholdK) : null;
  const set = (key: Key, value: string) => slot.edit({ ...slot.draft, [key]: value });
  const optionalTaken = slot.draft.flowC || slot.draft.returnC || slot.draft.roomC;
  const field = (key: Key, label: string, className = '') => (
    <NumberField
      key={key}
      label={label}
      name={`${phase}.${key}`}
      className={className}
      value={slot.draft[key]}
      onValueChange={(value) => set(key, value)}
      onEnter={() => void slot.flush()}
      onBlur={() => void slot.flush()}
      error={slot.errors[key]}
      disabled={!sheet.editable}
    />
  );
  return (
    <div role="group" aria-label={`Readings ${phase}`} data-field-scope="" className="space-y-3">
      <div className="flex flex-wrap items-center justify-end gap-2">
        <SavedMark
          status={slot.status}
          kept={slot.kept}
          stored={slot.stored}
          failure={slot.failure}
          incompleteWords="Not saved yet: give both"
          onRetry={() => void slot.flush()}
        />
      </div>
      <div className="grid grid-cols-2 gap-3">
        {field('topC', 'Top (°C)')}
        {field('bottomC', 'Bottom (°C)')}
      </div>
      <FiguresLine
        figures={live}
        ratedWatts={radiator.ratedWatts}
        roomTaken={parsed.ok && parsed.input.roomC != null}
      />
      <details open={Boolean(optionalTaken)} className="rounded-md border border-line">
        <summary className="flex min-h-12 cursor-pointer items-center px-3 font-semibold text-brand-800">
          Flow, return and room (if taken)
        </summary>
        <div className="grid grid-cols-2 gap-3 px-3 pb-3">
          {field('flowC', 'Flow (°C), if taken')}
          {field('returnC', 'Return (°C), if taken')}
          {field('roomC', 'Room (°C), if taken', 'col-span-2')}
        </div>
      </details>
    </div>
  );
}
