import { useState, type FormEvent } from 'react';
import {
  radiatorReadingInputSchema,
  readingFigures,
  type JobSheet,
  type ReadingFigures,
  type ReadingPhase,
  type SavedReading,
  type SheetRadiator,
} from '@heatfleet/domain';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { firstErrorPerField, type FieldErrors } from '@/lib/form';
import { useSaveReading } from '@/features/jobs/api/use-job-sheet-mutations';
import { SaveFeedback } from '@/features/jobs/components/save-feedback';
import { decimalOrNull, numberText } from '@/features/jobs/components/sheet-format';

const readingFields = [
  ['topC', 'Top (°C)'],
  ['bottomC', 'Bottom (°C)'],
  ['flowC', 'Flow (°C), if taken'],
  ['returnC', 'Return (°C), if taken'],
  ['roomC', 'Room (°C), if taken'],
] as const;
type ReadingDraft = Record<(typeof readingFields)[number][0], string>;

const phaseWords: Record<ReadingPhase, string> = { before: 'before', after: 'after' };

function readingDraft(saved: SavedReading | null): ReadingDraft {
  return {
    topC: numberText(saved?.topC),
    bottomC: numberText(saved?.bottomC),
    flowC: numberText(saved?.flowC),
    returnC: numberText(saved?.returnC),
    roomC: numberText(saved?.roomC),
  };
}

function readingInput(d: ReadingDraft): Record<keyof ReadingDraft, number | null> {
  return {
    topC: decimalOrNull(d.topC),
    bottomC: decimalOrNull(d.bottomC),
    flowC: decimalOrNull(d.flowC),
    returnC: decimalOrNull(d.returnC),
    roomC: decimalOrNull(d.roomC),
  };
}

export const watts = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 0 });

function FiguresView({
  figures,
  roomTaken,
  ratedWatts,
  live,
}: {
  figures: ReadingFigures | null;
  roomTaken: boolean;
  ratedWatts: number | null;
  live: boolean;
}) {
  if (!figures) return <p className="text-ink-muted">Enter the top and bottom temperatures to see the difference.</p>;
  return (
    <div className="space-y-1 rounded-md bg-canvas px-3 py-2">
      <p className="flex flex-wrap items-center gap-2">
        <span className="font-semibold tabular-nums">Top to bottom {figures.differenceK} K</span>
        {figures.coldBottom ? <Badge tone="danger">Cold bottom</Badge> : <Badge tone="ok">No cold bottom</Badge>}
      </p>
      <p className="tabular-nums">
        Mean water to room {figures.deltaTK} K{' '}
        <span className="text-ink-muted">
          ({figures.deltaTFrom === 'flow_return' ? 'from flow and return' : 'from the surfaces'}, room{' '}
          {figures.roomUsedC} °C{roomTaken ? '' : ' (not taken: the rating room)'})
        </span>
      </p>
      <p className="tabular-nums">
        {figures.outputWatts !== null && ratedWatts !== null
          ? `Output about ${watts.format(figures.outputWatts)} W of ${watts.format(ratedWatts)} W rated (EN 442)`
          : 'No rated output on the survey, so no output figure.'}
      </p>
      {live ? <p className="text-sm text-ink-muted">Worked out as you type; not saved yet.</p> : null}
    </div>
  );
}

/** One radiator's readings before or after the clean, with the figures worked out live by the domain's `readingFigures`. */
export function ReadingForm({
  jobId,
  radiator,
  phase,
  sheet,
}: {
  jobId: number;
  radiator: SheetRadiator;
  phase: ReadingPhase;
  sheet: JobSheet;
}) {
  const saved = radiator[phase];
  const [draft, setDraft] = useState<ReadingDraft>(() => readingDraft(saved));
  const [errors, setErrors] = useState<FieldErrors>({});
  const save = useSaveReading(jobId);
  const dirty = JSON.stringify(draft) !== JSON.stringify(readingDraft(saved));
  const parsed = radiatorReadingInputSchema.safeParse(readingInput(draft));
  const live = parsed.success ? readingFigures(parsed.data, radiator.ratedWatts, sheet.coldBottomThresholdK) : null;
  // Once saved and unchanged, the API's figures are the record.
  const figures = saved && !dirty ? saved : live;

  const submit = (event: FormEvent) => {
    event.preventDefault();
    if (!parsed.success) {
      setErrors(firstErrorPerField(parsed.error.issues));
      return;
    }
    setErrors({});
    save.mutate(
      { index: radiator.index, phase, reading: parsed.data },
      // The saved reading comes back with the room it assumed (20 °C when not taken): show that.
      {
        onSuccess: (next) =>
          setDraft(readingDraft(next.radiators.find((r) => r.index === radiator.index)?.[phase] ?? null)),
      },
    );
  };

  const title = `Readings ${phaseWords[phase]}`;
  return (
    <form
      aria-label={title}
      noValidate
      onSubmit={submit}
      className="space-y-3 rounded-lg border border-line-strong p-3"
    >
      <h4 className="font-bold">{phase === 'before' ? 'Before the clean' : 'After the clean'}</h4>
      <fieldset disabled={!sheet.editable} className="grid grid-cols-2 gap-3">
        {readingFields.map(([key, label]) => (
          <TextField
            key={key}
            label={label}
            name={key}
            inputMode="decimal"
            autoComplete="off"
            className={key === 'roomC' ? 'col-span-2' : ''}
            value={draft[key]}
            onChange={(e) => {
              save.reset();
              setDraft((d) => ({ ...d, [key]: e.target.value }));
            }}
            error={errors[key]}
          />
        ))}
      </fieldset>
      <FiguresView
        figures={figures}
        roomTaken={saved && !dirty ? saved.roomC != null : parsed.success && parsed.data.roomC != null}
        ratedWatts={radiator.ratedWatts}
        live={dirty && live !== null}
      />
      {sheet.editable ? (
        <>
          <SaveFeedback error={save.error} saved={save.isSuccess && !dirty} />
          <Button type="submit" variant="secondary" className="min-h-12 w-full" busy={save.isPending}>
            Save {phaseWords[phase]} readings
          </Button>
        </>
      ) : null}
    </form>
  );
}
