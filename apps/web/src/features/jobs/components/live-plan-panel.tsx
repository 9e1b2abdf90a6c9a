import { dosePlan, surveyVolume, type HeatExchangerDefaults, type Survey } from '@heatfleet/domain';
import { Badge } from '@/components/ui/badge';
import {
  DoseSummary,
  VolumeBreakdown,
  formatLitres,
  useGallonsToggle,
} from '@/features/jobs/components/volume-breakdown';

export interface DoseProduct {
  id: number;
  name: string;
  kind: string;
  packSizeMl: number;
  doseLitresPer100L: number | null;
  radiatorsPerPack: number | null;
}

/** Usable packs per product on the van that will do the job, when the form knows it (an engineer booking their own). */
export interface VanStock {
  vanName: string;
  usable: ReadonlyMap<number, number>;
}

/** The plan in a few lines, right above the booking button: the volume, its label, packs per product and the van. */
export function PlanLine({
  survey,
  products,
  heatExchangerDefaults,
  vanStock,
}: {
  survey: Survey;
  products: DoseProduct[];
  heatExchangerDefaults: HeatExchangerDefaults | null;
  vanStock: VanStock | null;
}) {
  const volume = surveyVolume(survey, heatExchangerDefaults);
  const radiators = survey.radiators.length;
  return (
    <div role="status" aria-label="The plan" className="space-y-1 rounded-lg bg-brand-50 px-3 py-2 text-brand-900">
      <p className="font-bold">
        System volume {formatLitres(volume.totalLitres, false)}{' '}
        <span className="font-normal">({volume.label.toLowerCase()})</span>
      </p>
      {products.map((p) => {
        const plan = dosePlan(volume.totalLitres, radiators, p);
        return (
          <p key={p.id}>
            {p.name}: {plan.packs} pack{plan.packs === 1 ? '' : 's'}
            {plan.litres === null ? '' : ` (${plan.litres.toFixed(2)} L)`}
            {vanStock ? <VanHolds held={vanStock.usable.get(p.id) ?? 0} needed={plan.packs} /> : null}
          </p>
        );
      })}
    </div>
  );
}

function VanHolds({ held, needed }: { held: number; needed: number }) {
  return held >= needed ? (
    <span className="font-semibold text-ok-700"> · the van holds {held}</span>
  ) : (
    <span className="font-semibold text-danger-700">
      {' '}
      · the van holds {held}, {needed - held} short
    </span>
  );
}

/** Worked out in the browser as the survey is typed; the API works it out again when the job is booked. */
export function LivePlanPanel({
  survey,
  products,
  heatExchangerDefaults,
}: {
  survey: Survey;
  products: DoseProduct[];
  heatExchangerDefaults: HeatExchangerDefaults | null;
}) {
  const { withGallons, toggle } = useGallonsToggle();
  const volume = surveyVolume(survey, heatExchangerDefaults);
  const radiators = survey.radiators.length;
  return (
    <>
      <section
        aria-labelledby="live-plan-heading"
        className="space-y-4 rounded-xl border border-line bg-card p-4 shadow-sm sm:p-6"
      >
        <h2 id="live-plan-heading" className="text-lg font-bold text-brand-900">
          Volume and dose, as you type
        </h2>
        {toggle}
        <VolumeBreakdown volume={volume} withGallons={withGallons} />
        <div className="space-y-4 border-t border-line pt-4">
          <h3 className="font-bold text-brand-900">Dose</h3>
          {products.length === 0 ? (
            <p className="text-ink-muted">Choose the products to dose to see how much each needs.</p>
          ) : (
            products.map((product) => (
              <DoseSummary
                key={product.id}
                dose={{ product, ...dosePlan(volume.totalLitres, radiators, product) }}
                radiators={radiators}
                withGallons={withGallons}
              />
            ))
          )}
        </div>
        <p className="text-sm text-ink-muted">
          These figures support your judgement; they do not replace it. The plan saved with the job also checks your
          van&apos;s stock.
        </p>
      </section>
      {/* On a phone the panel sits below the form, so the total stays in view at the foot of the screen. */}
      <div className="fixed inset-x-0 bottom-0 z-10 border-t border-line bg-card px-4 py-2 shadow-lg lg:hidden print:hidden">
        <p
          role="status"
          aria-label="Live system volume"
          className="flex flex-wrap items-center gap-2 font-bold text-brand-900"
        >
          <span>Volume {formatLitres(volume.totalLitres, withGallons)}</span>
          {volume.estimate ? <Badge tone="warn">Estimated</Badge> : null}
        </p>
      </div>
    </>
  );
}
