import { useId } from 'react';
import type { JobSheet } from '@heatfleet/domain';
import { useSheetPut } from '@/features/jobs/api/use-job-sheet-mutations';
import { useAutosave } from '@/features/jobs/components/autosave-context';
import { SavedMark } from '@/features/jobs/components/saved-mark';

/** The kit used on the job, chosen from what the van holds now; each tick saves the set. */
export function KitUsedForm({ jobId, sheet }: { jobId: number; sheet: JobSheet }) {
  const id = useId();
  const put = useSheetPut(jobId);
  const slot = useAutosave('kit', () => sheet.kitUsed.map((k) => k.id), {
    label: 'Kit used',
    parse: (ids: number[]) => ({ ok: true, input: [...ids].sort((a, b) => a - b) }),
    send: (kitItemIds: number[]) => put('/kit', { kitItemIds }),
    savedInput: sheet.kitUsed.map((k) => k.id).sort((a, b) => a - b),
  });
  const chosen = slot.draft;
  // Items recorded earlier stay listed even once they have left the van.
  const items = [...sheet.kitOnVan, ...sheet.kitUsed.filter((k) => !sheet.kitOnVan.some((v) => v.id === k.id))];

  if (items.length === 0) return <p className="text-ink-muted">The job&apos;s van holds no kit items just now.</p>;
  return (
    <div role="group" aria-label="Kit used" className="space-y-3">
      <fieldset disabled={!sheet.editable} className="space-y-2">
        <legend className="mb-1 text-ink-muted">Tick each item used on this job.</legend>
        {items.map((item) => (
          <label
            key={item.id}
            htmlFor={`${id}-${item.id}`}
            className="flex min-h-12 cursor-pointer items-center gap-3 rounded-lg border-2 border-line-strong px-3 py-2 has-[:checked]:border-brand-700 has-[:checked]:bg-brand-50"
          >
            <input
              id={`${id}-${item.id}`}
              type="checkbox"
              className="size-6 shrink-0 accent-brand-700"
              checked={chosen.includes(item.id)}
              onChange={(e) => {
                slot.edit(e.target.checked ? [...chosen, item.id] : chosen.filter((x) => x !== item.id));
                void slot.flush();
              }}
            />
            <span className="min-w-0">
              <span className="block font-semibold">
                <span className="font-mono">{item.assetTag}</span> {item.kindName}
              </span>
              {item.kitName ? <span className="block text-sm text-ink-muted">{item.kitName}</span> : null}
            </span>
          </label>
        ))}
      </fieldset>
      <SavedMark
        status={slot.status}
        kept={slot.kept}
        stored={slot.stored && chosen.length > 0}
        failure={slot.failure}
        onRetry={() => void slot.flush()}
      />
    </div>
  );
}
