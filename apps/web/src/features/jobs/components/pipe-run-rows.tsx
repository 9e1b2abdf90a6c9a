import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import type { FieldErrors } from '@/lib/form';
import { emptyPipeRun, tubeLabels, type PipeRunDraft, type TubeSize } from '@/features/jobs/components/survey-draft';

const tubeOptions = (Object.keys(tubeLabels) as TubeSize[]).map((t) => ({ value: t, label: tubeLabels[t] }));

export function PipeRunRows({
  rows,
  onChange,
  errors,
}: {
  rows: PipeRunDraft[];
  onChange: (rows: PipeRunDraft[]) => void;
  errors: FieldErrors;
}) {
  const update = (key: number, patch: Partial<PipeRunDraft>) =>
    onChange(rows.map((r) => (r.key === key ? { ...r, ...patch } : r)));
  return (
    <fieldset className="space-y-3">
      <legend className="text-lg font-bold text-brand-900">Pipe runs</legend>
      <p className="text-ink-muted">Copper sizes use the usual heating tube walls; for plastic give the bore.</p>
      {rows.map((row, i) => {
        const at = `survey.pipeRuns.${i}`;
        const n = i + 1;
        return (
          <div
            key={row.key}
            role="group"
            aria-label={`Pipe run ${n}`}
            className="space-y-3 rounded-lg border border-line-strong p-3"
          >
            <div className="flex items-center justify-between gap-2">
              <p className="font-bold">Pipe run {n}</p>
              <Button
                variant="danger"
                onClick={() => onChange(rows.filter((r) => r.key !== row.key))}
                aria-label={`Remove pipe run ${n}`}
              >
                Remove
              </Button>
            </div>
            <div className="grid gap-3 sm:grid-cols-3">
              <SelectField
                label="Tube"
                name={`${at}.tube`}
                options={tubeOptions}
                value={row.tube}
                onChange={(e) => update(row.key, { tube: e.target.value as TubeSize })}
              />
              {row.tube === 'plastic' ? (
                <TextField
                  label="Bore (mm)"
                  name={`${at}.boreMm`}
                  inputMode="decimal"
                  value={row.boreMm}
                  onChange={(e) => update(row.key, { boreMm: e.target.value })}
                  error={errors[`${at}.boreMm`]}
                />
              ) : null}
              <TextField
                label="Length (m)"
                name={`${at}.lengthM`}
                inputMode="decimal"
                value={row.lengthM}
                onChange={(e) => update(row.key, { lengthM: e.target.value })}
                error={errors[`${at}.lengthM`]}
              />
            </div>
          </div>
        );
      })}
      <Button variant="secondary" className="w-full sm:w-auto" onClick={() => onChange([...rows, emptyPipeRun()])}>
        Add a pipe run
      </Button>
    </fieldset>
  );
}
