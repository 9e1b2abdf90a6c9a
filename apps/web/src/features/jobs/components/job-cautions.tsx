/** Our own words for the hazards of a cleaning visit; shown on the job screens before anything is done. */
export const jobCautions = [
  'Hot water and surfaces scald: let the system cool before draining.',
  'Isolate the boiler electrically and prove it dead before working on it.',
  'Work on gas appliances only by a business on the Gas Safe Register; oil appliances only by a competent, registered person.',
  "Read the product's safety data sheet; wear gloves and eye protection; never mix cleaners.",
  'Flushing water and sludge go to a foul drain, never a surface-water drain.',
  'Do not over-pressurise old open-vented pipework; sealed systems relieve at about 3 bar.',
  "These figures support your judgement; they do not replace it. Follow local codes, the manufacturers' instructions and licensed practice.",
] as const;

export function JobCautions() {
  return (
    <section aria-labelledby="job-cautions-heading" className="rounded-xl border-l-4 border-ember-500 bg-ember-100 p-4">
      <h2 id="job-cautions-heading" className="text-lg font-bold text-ember-700">
        Before you start
      </h2>
      <ul className="mt-2 list-disc space-y-1 pl-5 text-ink">
        {jobCautions.map((caution) => (
          <li key={caution}>{caution}</li>
        ))}
      </ul>
    </section>
  );
}
