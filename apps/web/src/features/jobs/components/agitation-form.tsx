import { useState, type FormEvent } from 'react';
import {
  agitationInputSchema,
  agitationPoints,
  havDayPointsIfSaved,
  type JobSheet,
  type SheetRadiator,
} from '@heatfleet/domain';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { firstErrorPerField, type FieldErrors } from '@/lib/form';
import { useSaveAgitation } from '@/features/jobs/api/use-job-sheet-mutations';
import { SaveFeedback } from '@/features/jobs/components/save-feedback';
import { decimalOrNull, finiteOrNull, numberText } from '@/features/jobs/components/sheet-format';

function toolLabel(item: { assetTag: string; kindName: string; vibrationMs2?: number | null }): string {
  // The tag and the magnitude first: a phone's select cuts the end of a long option off.
  const vibration = item.vibrationMs2 == null ? 'no vibration figure' : `${item.vibrationMs2} m/s²`;
  return `${item.assetTag} · ${vibration} · ${item.kindName}`;
}

/** One radiator's agitation: the minutes and the vibrating tool, with its points and the day's total if saved. */
export function AgitationForm({ jobId, radiator, sheet }: { jobId: number; radiator: SheetRadiator; sheet: JobSheet }) {
  const saved = radiator.agitation;
  const savedDraft = {
    minutes: numberText(saved?.minutes),
    kitItemId: saved?.kitItemId ? String(saved.kitItemId) : '',
  };
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
  const magnitude =
    chosenId === null
      ? null
      : (tools.find((t) => t.id === chosenId)?.vibrationMs2 ?? (gone ? saved?.magnitudeMs2 : null) ?? null);
  const minutes = finiteOrNull(draft.minutes);
  // The same rules the API applies to the saved agitation and the day (HSE points system).
  const livePoints = minutes === null ? 0 : agitationPoints(magnitude, minutes);
  const points = dirty ? livePoints : (saved?.points ?? 0);
  const dayIfSaved = havDayPointsIfSaved(sheet.hav.points, saved?.points ?? 0, livePoints);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const parsed = agitationInputSchema.safeParse({ minutes: decimalOrNull(draft.minutes), kitItemId: chosenId });
    if (!parsed.success) {
      setErrors(firstErrorPerField(parsed.error.issues));
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
    <form
      aria-label="Agitation"
      noValidate
      onSubmit={submit}
      className="space-y-3 rounded-lg border border-line-strong p-3"
    >
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
        {magnitude ? null : (
          <span className="text-ink-muted"> (choose a tool with a vibration figure to count them)</span>
        )}
      </p>
      {dirty && sheet.editable ? (
        <p className="text-sm text-ink-muted">About {dayIfSaved} points for the day once saved.</p>
      ) : null}
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
