import { cautionKeys, cautionTexts, type CautionKey } from '@heatfleet/domain';

/** All the cautions of a cleaning visit, in the domain's words (the PDF report prints the same). */
export function JobCautions() {
  return (
    <section aria-labelledby="job-cautions-heading" className="rounded-xl border-l-4 border-ember-500 bg-ember-100 p-4">
      <h2 id="job-cautions-heading" className="text-lg font-bold text-ember-700">
        Before you start
      </h2>
      <ul className="mt-2 list-disc space-y-1 pl-5 text-ink">
        {cautionKeys.map((key) => (
          <li key={key}>{cautionTexts[key]}</li>
        ))}
      </ul>
    </section>
  );
}

/** The cautions that protect one step, printed right above its tick so they are read before it is done. */
export function StepCautions({ keys, label }: { keys: readonly CautionKey[]; label: string }) {
  if (keys.length === 0) return null;
  return (
    <ul aria-label={label} className="space-y-1 rounded-md border-l-4 border-ember-500 bg-ember-100 px-3 py-2 text-ink">
      {keys.map((key) => (
        <li key={key} className="flex gap-2">
          <span aria-hidden="true" className="font-bold text-ember-700">
            !
          </span>
          <span>{cautionTexts[key]}</span>
        </li>
      ))}
    </ul>
  );
}

export function JudgementNote() {
  return <p className="rounded-md bg-brand-50 px-3 py-2 text-sm text-brand-800">{cautionTexts.judgement}</p>;
}
