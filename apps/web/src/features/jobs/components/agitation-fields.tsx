import {
  agitationInputSchema,
  agitationPoints,
  type AgitationInput,
  type JobSheet,
  type SheetRadiator,
} from '@heatfleet/domain';
import { NumberField } from '@/components/ui/number-field';
import { SelectField } from '@/components/ui/select-field';
import type { Parsed } from '@/features/jobs/api/autosave-store';
import { useSheetPut } from '@/features/jobs/api/use-job-sheet-mutations';
import { useAutosave } from '@/features/jobs/components/autosave-context';
import { SavedMark } from '@/features/jobs/components/saved-mark';
import { decimalOrNull, numberText } from '@/features/jobs/components/sheet-format';

interface AgitationDraft {
  minutes: string;
  kitItemId: string;
}

function toolLabel(item: { assetTag: string; kindName: string; vibrationMs2?: number | null }): string {
  // The tag and the magnitude first: a phone's select cuts the end of a long option off.
  const vibration = item.vibrationMs2 == null ? 'no vibration figure' : `${item.vibrationMs2} m/s²`;
  return `${item.assetTag} · ${vibration} · ${item.kindName}`;
}

function parseAgitation(draft: AgitationDraft): Parsed<AgitationInput> {
  const minutes = decimalOrNull(draft.minutes);
  if (minutes === null) return { ok: false, empty: true, errors: {} };
  const parsed = agitationInputSchema.safeParse({
    minutes,
    kitItemId: draft.kitItemId ? Number(draft.kitItemId) : null,
  });
  if (parsed.success) return { ok: true, input: parsed.data };
  const errors: Record<string, string> = {};
  for (const issue of parsed.error.issues) errors[String(issue.path[0])] ??= issue.message;
  return { ok: false, empty: false, errors };
}

/** "5 min, RIG1-AGI": a saved agitation on one line. */
export function agitationSummary(a: SheetRadiator['agitation']): string {
  if (!a) return 'not recorded';
  return `${a.minutes} min${a.kitItemTag ? `, ${a.kitItemTag}` : ''}`;
}

/**
 * One radiator's agitation: the minutes (saved as soon as they are a whole number) and the vibrating
 * tool, which starts as the one used on the radiator before; its HSE points shown as typed.
 */
export function AgitationFields({
  jobId,
  radiator,
  sheet,
  name,
  defaultTool,
}: {
  jobId: number;
  radiator: SheetRadiator;
  sheet: JobSheet;
  name: string;
  defaultTool: number | null;
}) {
  const put = useSheetPut(jobId);
  const saved = radiator.agitation;
  const slot = useAutosave(
    `agitation:${radiator.index}`,
    (): AgitationDraft => ({
      minutes: numberText(saved?.minutes),
      kitItemId: saved ? (saved.kitItemId ? String(saved.kitItemId) : '') : defaultTool ? String(defaultTool) : '',
    }),
    {
      label: `${name}: agitation`,
      parse: parseAgitation,
      send: (input: AgitationInput) => put(`/radiators/${radiator.index}/agitation`, input),
      savedInput: saved ? { minutes: saved.minutes, kitItemId: saved.kitItemId } : null,
    },
  );
  const tools = sheet.kitOnVan;
  // A tool saved earlier that has since left the van still names what was used.
  const gone = saved?.kitItemId && !tools.some((t) => t.id === saved.kitItemId) ? saved : null;
  const options = [
    { value: '', label: 'No vibrating tool recorded' },
    ...tools.map((t) => ({ value: String(t.id), label: toolLabel(t) })),
    ...(gone ? [{ value: String(gone.kitItemId), label: `${gone.kitItemTag ?? 'Tool'} (no longer on the van)` }] : []),
  ];
  const chosenId = slot.draft.kitItemId ? Number(slot.draft.kitItemId) : null;
  const magnitude =
    chosenId === null
      ? null
      : (tools.find((t) => t.id === chosenId)?.vibrationMs2 ?? (gone ? saved?.magnitudeMs2 : null) ?? null);
  const parsed = parseAgitation(slot.draft);
  // The same rule the API applies to the saved agitation (HSE points system).
  const points = parsed.ok ? agitationPoints(magnitude, parsed.input.minutes) : (saved?.points ?? 0);
  return (
    <div role="group" aria-label="Agitation" className="space-y-3">
      <div className="flex flex-wrap items-center justify-end gap-2">
        <SavedMark
          status={slot.status}
          stored={slot.stored}
          kept={slot.kept}
          failure={slot.failure}
          onRetry={() => void slot.flush()}
        />
      </div>
      <div className="grid grid-cols-[minmax(0,2fr)_minmax(0,3fr)] items-start gap-3">
        <NumberField
          label="Agitation (minutes)"
          name="minutes"
          whole
          value={slot.draft.minutes}
          onValueChange={(minutes) => slot.edit({ ...slot.draft, minutes })}
          onEnter={() => void slot.flush()}
          onBlur={() => void slot.flush()}
          error={slot.errors.minutes}
          disabled={!sheet.editable}
        />
        <SelectField
          label="Vibrating tool"
          className="[&_select]:min-h-12"
          options={options}
          value={slot.draft.kitItemId}
          onChange={(e) => {
            slot.edit({ ...slot.draft, kitItemId: e.target.value });
            void slot.flush();
          }}
          error={slot.errors.kitItemId}
          disabled={!sheet.editable}
        />
      </div>
      <p className="text-sm tabular-nums">
        <span className="font-semibold">{points} vibration points</span> on this radiator
        {magnitude ? null : (
          <span className="text-ink-muted"> (choose a tool with a vibration figure to count them)</span>
        )}
      </p>
    </div>
  );
}
