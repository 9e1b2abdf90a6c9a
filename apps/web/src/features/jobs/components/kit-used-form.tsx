import { useId, useState, type FormEvent } from 'react';
import type { JobSheet } from '@heatfleet/domain';
import { Button } from '@/components/ui/button';
import { useSaveKitUsed } from '@/features/jobs/api/use-job-sheet-mutations';
import { SaveFeedback } from '@/features/jobs/components/save-feedback';

function sameSet(a: number[], b: number[]): boolean {
  return a.length === b.length && a.every((id) => b.includes(id));
}

/** The kit used on the job, chosen from what the van holds now; saved as a whole set. */
export function KitUsedForm({ jobId, sheet }: { jobId: number; sheet: JobSheet }) {
  const id = useId();
  const savedIds = sheet.kitUsed.map((k) => k.id);
  const [chosen, setChosen] = useState<number[]>(savedIds);
  const save = useSaveKitUsed(jobId);
  const dirty = !sameSet(chosen, savedIds);
  // Items recorded earlier stay listed even once they have left the van.
  const items = [...sheet.kitOnVan, ...sheet.kitUsed.filter((k) => !sheet.kitOnVan.some((v) => v.id === k.id))];

  const submit = (event: FormEvent) => {
    event.preventDefault();
    save.mutate(chosen, { onSuccess: (next) => setChosen(next.kitUsed.map((k) => k.id)) });
  };

  if (items.length === 0) return <p className="text-ink-muted">The job&apos;s van holds no kit items just now.</p>;
  return (
    <form aria-label="Kit used" noValidate onSubmit={submit} className="space-y-3">
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
                save.reset();
                setChosen((c) => (e.target.checked ? [...c, item.id] : c.filter((x) => x !== item.id)));
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
      {sheet.editable ? (
        <>
          <SaveFeedback error={save.error} saved={save.isSuccess && !dirty} />
          <Button type="submit" variant="secondary" className="min-h-12 w-full sm:w-auto" busy={save.isPending}>
            Save the kit used
          </Button>
        </>
      ) : null}
    </form>
  );
}
