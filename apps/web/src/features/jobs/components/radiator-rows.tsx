import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import type { FieldErrors } from '@/lib/form';
import { emptyRadiator, panelLabels, type RadiatorDraft } from '@/features/jobs/components/survey-draft';
import { panelTypes } from '@heatfleet/domain';

const panelOptions = panelTypes.map((p) => ({ value: p, label: panelLabels[p] }));

/** "Same as the previous radiator": its kind, size and rated output, not its room. */
function sameAs(r: RadiatorDraft): Partial<RadiatorDraft> {
  return { panel: r.panel, heightMm: r.heightMm, lengthMm: r.lengthMm, litres: r.litres, ratedWatts: r.ratedWatts };
}

export function RadiatorRows({
  rows,
  onChange,
  errors,
}: {
  rows: RadiatorDraft[];
  onChange: (rows: RadiatorDraft[]) => void;
  errors: FieldErrors;
}) {
  const update = (key: number, patch: Partial<RadiatorDraft>) =>
    onChange(rows.map((r) => (r.key === key ? { ...r, ...patch } : r)));
  return (
    <fieldset className="space-y-3">
      <legend className="sr-only">Radiators one by one</legend>
      <p className="text-ink-muted">
        Name the rooms and refine any radiator: the height and length, or the litres from the maker&apos;s data. Without
        sizes the volume is estimated.
      </p>
      {rows.map((row, i) => {
        const at = `survey.radiators.${i}`;
        const n = i + 1;
        return (
          <div
            key={row.key}
            role="group"
            aria-label={`Radiator ${n}`}
            className="space-y-3 rounded-lg border border-line-strong p-3"
          >
            <div className="flex flex-wrap items-center justify-between gap-2">
              <p className="font-bold">Radiator {n}</p>
              <span className="flex gap-2">
                {i > 0 ? (
                  <Button
                    variant="secondary"
                    className="min-h-12"
                    aria-label={`Radiator ${n} the same as radiator ${n - 1}`}
                    onClick={() => update(row.key, sameAs(rows[i - 1]!))}
                  >
                    Same as {n - 1}
                  </Button>
                ) : null}
                <Button
                  variant="danger"
                  className="min-h-12"
                  onClick={() => onChange(rows.filter((r) => r.key !== row.key))}
                  aria-label={`Remove radiator ${n}`}
                >
                  Remove
                </Button>
              </span>
            </div>
            <div className="grid gap-3 sm:grid-cols-2">
              <TextField
                label="Room"
                name={`${at}.room`}
                value={row.room}
                onChange={(e) => update(row.key, { room: e.target.value })}
                error={errors[`${at}.room`]}
              />
              <SelectField
                label="Panel type"
                name={`${at}.panel`}
                options={panelOptions}
                value={row.panel}
                onChange={(e) => update(row.key, { panel: e.target.value as RadiatorDraft['panel'] })}
              />
              <TextField
                label="Height (mm)"
                name={`${at}.heightMm`}
                inputMode="numeric"
                value={row.heightMm}
                onChange={(e) => update(row.key, { heightMm: e.target.value })}
                error={errors[`${at}.heightMm`]}
              />
              <TextField
                label="Length (mm)"
                name={`${at}.lengthMm`}
                inputMode="numeric"
                value={row.lengthMm}
                onChange={(e) => update(row.key, { lengthMm: e.target.value })}
                error={errors[`${at}.lengthMm`]}
              />
              <TextField
                label="Or litres, if known"
                name={`${at}.litres`}
                inputMode="decimal"
                value={row.litres}
                onChange={(e) => update(row.key, { litres: e.target.value })}
                error={errors[`${at}.litres`]}
              />
              <TextField
                label="Rated output (W), if known"
                name={`${at}.ratedWatts`}
                inputMode="numeric"
                value={row.ratedWatts}
                onChange={(e) => update(row.key, { ratedWatts: e.target.value })}
                error={errors[`${at}.ratedWatts`]}
              />
              <TextField
                label="Cold spot note (optional)"
                name={`${at}.coldSpotNote`}
                value={row.coldSpotNote}
                onChange={(e) => update(row.key, { coldSpotNote: e.target.value })}
                error={errors[`${at}.coldSpotNote`]}
              />
            </div>
          </div>
        );
      })}
      <Button
        variant="secondary"
        className="min-h-12 w-full sm:w-auto"
        onClick={() => {
          const last = rows[rows.length - 1];
          onChange([...rows, last ? { ...emptyRadiator(), ...sameAs(last) } : emptyRadiator()]);
        }}
      >
        Add a radiator
      </Button>
    </fieldset>
  );
}
