import type { JobSheet } from '@heatfleet/domain';
import { cautionTexts } from '@heatfleet/domain';

type Caution = JobSheet['cautions'][number];

/** The visit's cautions, only those that fit its system, fuel and kind (the API's `visitCautions`). */
export function JobCautions({ cautions }: { cautions: readonly Caution[] }) {
  return (
    <ul className="list-disc space-y-1 pl-5 text-ink">
      {cautions.map((c) => (
        <li key={c.key}>{c.text}</li>
      ))}
    </ul>
  );
}

/** The cautions that protect one step, printed right above its tick so they are read before it is done. */
export function StepCautions({ cautions, label }: { cautions: readonly Caution[]; label: string }) {
  if (cautions.length === 0) return null;
  return (
    <ul aria-label={label} className="space-y-1 rounded-md border-l-4 border-ember-500 bg-ember-100 px-3 py-2 text-ink">
      {cautions.map((c) => (
        <li key={c.key} className="flex gap-2">
          <span aria-hidden="true" className="font-bold text-ember-700">
            !
          </span>
          <span>{c.text}</span>
        </li>
      ))}
    </ul>
  );
}

export function JudgementNote() {
  return <p className="rounded-md bg-brand-50 px-3 py-2 text-sm text-brand-800">{cautionTexts.judgement}</p>;
}
