import { useState, type FormEvent } from 'react';
import {
  agitationInputSchema,
  radiatorReadingInputSchema,
  readingFigures,
  vibrationPoints,
  type ReadingFigures,
  type ReadingPhase,
} from '@heatfleet/domain';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import type { FieldErrors } from '@/lib/form';
import type { JobSheet, SavedReading, SheetRadiator } from '@/features/jobs/api/job-queries';
import { useSaveAgitation, useSaveReading, useTickFlushed } from '@/features/jobs/api/use-job-sheet-mutations';
import { JudgementNote } from '@/features/jobs/components/job-cautions';
import { SaveFeedback } from '@/features/jobs/components/save-feedback';
import { decimalOrNull, finiteOrNull, formatClock, numberText } from '@/features/jobs/components/sheet-format';
import { panelLabels, type PanelType } from '@/features/jobs/components/survey-draft';

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

function issuesByField(issues: ReadonlyArray<{ path: PropertyKey[]; message: string }>): FieldErrors {
  const out: FieldErrors = {};
  for (const issue of issues) out[issue.path.map(String).join('.')] ??= issue.message;
  return out;
}

const watts = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 0 });

function FiguresView({ figures, roomTaken, ratedWatts, live }: { figures: ReadingFigures | null; roomTaken: boolean; ratedWatts: number | null; live: boolean }) {
  if (!figures) return <p className="text-ink-muted">Enter the top and bottom temperatures to see the difference.</p>;
  return (
    <div className="space-y-1 rounded-md bg-canvas px-3 py-2">
      <p className="flex flex-wrap items-center gap-2">
        <span className="font-semibold tabular-nums">Top to bottom {figures.differenceK} K</span>
        {figures.coldBottom ? <Badge tone="danger">Cold bottom</Badge> : <Badge tone="ok">No cold bottom</Badge>}
      </p>
      <p className="tabular-nums">
        Mean water to room {figures.deltaTK} K <span className="text-ink-muted">({figures.deltaTFrom === 'flow_return' ? 'from flow and return' : 'from the surfaces'}, room {figures.roomUsedC} °C{roomTaken ? '' : ' (not taken: the rating room)'})</span>
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

function ReadingForm({ jobId, radiator, phase, sheet }: { jobId: number; radiator: SheetRadiator; phase: ReadingPhase; sheet: JobSheet }) {
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
      setErrors(issuesByField(parsed.error.issues));
      return;
    }
    setErrors({});
    save.mutate(
      { index: radiator.index, phase, reading: parsed.data },
      // The saved reading comes back with the room it assumed (20 °C when not taken): show that.
      { onSuccess: (next) => setDraft(readingDraft(next.radiators.find((r) => r.index === radiator.index)?.[phase] ?? null)) },
    );
  };

  const title = `Readings ${phaseWords[phase]}`;
  return (
    <form aria-label={title} noValidate onSubmit={submit} className="space-y-3 rounded-lg border border-line-strong p-3">
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
      <FiguresView figures={figures} roomTaken={saved && !dirty ? saved.roomC != null : parsed.success && parsed.data.roomC != null} ratedWatts={radiator.ratedWatts} live={dirty && live !== null} />
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

function toolLabel(item: { assetTag: string; kindName: string; vibrationMs2?: number | null }): string {
  // The tag and the magnitude first: a phone's select cuts the end of a long option off.
  const vibration = item.vibrationMs2 == null ? 'no vibration figure' : `${item.vibrationMs2} m/s²`;
  return `${item.assetTag} · ${vibration} · ${item.kindName}`;
}

function AgitationForm({ jobId, radiator, sheet }: { jobId: number; radiator: SheetRadiator; sheet: JobSheet }) {
  const saved = radiator.agitation;
  const savedDraft = { minutes: numberText(saved?.minutes), kitItemId: saved?.kitItemId ? String(saved.kitItemId) : '' };
  const [draft, setDraft] = useState(savedDraft);
  const [errors, setErrors] = useState<FieldErrors>({});
  const save = useSaveAgitation(jobId);
  const dirty = draft.minutes !== savedDraft.minutes || draft.kitItemId !== savedDraft.kitItemId;

  const tools = [...sheet.kitOnVan];
  // A tool saved earlier that has since left the van still names what was used.
  const gone = saved?.kitItemId && !tools.some((t) => t.id === saved.kitItemId) ? saved : null;
  const options = [
    { value: '', label: 'No vibrating tool recorded' },
    ...tools.map((t) => ({ value: String(t.id), label: toolLabel(t) })),
    ...(gone ? [{ value: String(gone.kitItemId), label: `${gone.kitItemTag ?? 'Tool'} (no longer on the van)` }] : []),
  ];
  const chosenId = draft.kitItemId ? Number(draft.kitItemId) : null;
  const magnitude = chosenId === null ? null : (tools.find((t) => t.id === chosenId)?.vibrationMs2 ?? (gone ? saved?.magnitudeMs2 : null) ?? null);
  const minutes = finiteOrNull(draft.minutes);
  const livePoints = magnitude && minutes !== null && minutes > 0 ? Math.round(vibrationPoints(magnitude, minutes / 60) * 10) / 10 : 0;
  const points = dirty ? livePoints : (saved?.points ?? 0);
  const dayIfSaved = Math.round((sheet.hav.points - (saved?.points ?? 0) + livePoints) * 10) / 10;

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const parsed = agitationInputSchema.safeParse({ minutes: decimalOrNull(draft.minutes), kitItemId: chosenId });
    if (!parsed.success) {
      setErrors(issuesByField(parsed.error.issues));
      return;
    }
    setErrors({});
    save.mutate(
      { index: radiator.index, agitation: parsed.data },
      {
        onSuccess: (next) => {
          const a = next.radiators.find((r) => r.index === radiator.index)?.agitation;
          setDraft({ minutes: numberText(a?.minutes), kitItemId: a?.kitItemId ? String(a.kitItemId) : '' });
        },
      },
    );
  };

  return (
    <form aria-label="Agitation" noValidate onSubmit={submit} className="space-y-3 rounded-lg border border-line-strong p-3">
      <h4 className="font-bold">Agitation</h4>
      <fieldset disabled={!sheet.editable} className="grid gap-3">
        <TextField
          label="Agitation (minutes)"
          name="minutes"
          inputMode="numeric"
          autoComplete="off"
          value={draft.minutes}
          onChange={(e) => {
            save.reset();
            setDraft((d) => ({ ...d, minutes: e.target.value }));
          }}
          error={errors.minutes}
        />
        <SelectField
          label="Vibrating tool"
          options={options}
          value={draft.kitItemId}
          onChange={(e) => {
            save.reset();
            setDraft((d) => ({ ...d, kitItemId: e.target.value }));
          }}
          error={errors.kitItemId}
        />
      </fieldset>
      <p className="tabular-nums">
        <span className="font-semibold">{points} vibration points</span> on this radiator
        {magnitude ? null : <span className="text-ink-muted"> (choose a tool with a vibration figure to count them)</span>}
      </p>
      {dirty && sheet.editable ? <p className="text-sm text-ink-muted">About {dayIfSaved} points for the day once saved.</p> : null}
      {sheet.editable ? (
        <>
          <SaveFeedback error={save.error} saved={save.isSuccess && !dirty} />
          <Button type="submit" variant="secondary" className="min-h-12 w-full" busy={save.isPending}>
            Save agitation
          </Button>
        </>
      ) : null}
    </form>
  );
}

function panelLabel(panel: string): string {
  return panel in panelLabels ? panelLabels[panel as PanelType] : panel;
}

/** Flushed until clear, ticked radiator by radiator: the flush step's record for each one. */
function FlushedTick({ jobId, radiator, sheet, timeZone }: { jobId: number; radiator: SheetRadiator; sheet: JobSheet; timeZone: string }) {
  const tick = useTickFlushed(jobId);
  const busy = tick.isPending && tick.variables.index === radiator.index;
  const done = radiator.flushedAt !== null;
  return (
    <div className="space-y-2">
      {sheet.editable && !done ? (
        <Button variant="secondary" className="min-h-12 w-full" busy={busy} onClick={() => tick.mutate({ index: radiator.index, done: true })}>
          Flushed until clear
        </Button>
      ) : (
        <p className={`flex min-h-12 items-center gap-2 rounded-lg border-2 px-3 ${done ? 'border-ok-700 bg-ok-50' : 'border-line text-ink-muted'}`}>
          {done ? `✓ Flushed until clear at ${formatClock(radiator.flushedAt!, timeZone)}` : 'Not recorded as flushed.'}
        </p>
      )}
      {sheet.editable && done ? (
        <Button variant="secondary" className="min-h-12" busy={busy} aria-label={`Untick flushed: radiator ${radiator.index + 1}`} onClick={() => tick.mutate({ index: radiator.index, done: false })}>
          Untick
        </Button>
      ) : null}
      {tick.isError && tick.variables.index === radiator.index ? <p role="alert" className="font-semibold text-ember-700">{tick.error.message}</p> : null}
    </div>
  );
}

export function RadiatorLog({ jobId, sheet, timeZone }: { jobId: number; sheet: JobSheet; timeZone: string }) {
  if (sheet.radiators.length === 0) return <p className="text-ink-muted">The survey lists no radiators.</p>;
  return (
    <div className="space-y-4">
      <p className="text-ink-muted">A cold bottom is flagged when the top is more than {sheet.coldBottomThresholdK} K warmer than the bottom (the firm&apos;s setting).</p>
      <JudgementNote />
      {sheet.radiators.map((radiator) => {
        const name = `Radiator ${radiator.index + 1}: ${radiator.room}`;
        return (
          <div key={radiator.index} role="group" aria-label={name} className="space-y-3 rounded-xl border-2 border-line-strong p-3">
            <div>
              <h3 className="text-lg font-bold text-brand-900">{name}</h3>
              <p className="text-sm text-ink-muted">
                {panelLabel(radiator.panel)} · {radiator.ratedWatts ? `rated ${watts.format(radiator.ratedWatts)} W at dT 50` : 'no rated output'}
              </p>
            </div>
            <div className="grid gap-3 lg:grid-cols-3">
              <ReadingForm jobId={jobId} radiator={radiator} phase="before" sheet={sheet} />
              <AgitationForm jobId={jobId} radiator={radiator} sheet={sheet} />
              <ReadingForm jobId={jobId} radiator={radiator} phase="after" sheet={sheet} />
            </div>
            <FlushedTick jobId={jobId} radiator={radiator} sheet={sheet} timeZone={timeZone} />
          </div>
        );
      })}
    </div>
  );
}

export function radiatorsSummary(sheet: JobSheet): string {
  const read = sheet.radiators.filter((r) => r.before && r.after).length;
  const cold = sheet.radiators.filter((r) => (r.after ?? r.before)?.coldBottom).length;
  return `${read} of ${sheet.radiators.length} read before and after${cold ? ` · ${cold} with a cold bottom` : ''}`;
}
