import type { JobDetail } from '@heatfleet/domain';
import { formatCalendarDate } from '@/lib/format';
import { SheetSection } from '@/features/jobs/components/sheet-section';
import {
  DoseSummary,
  VolumeBreakdown,
  formatLitres,
  useGallonsToggle,
} from '@/features/jobs/components/volume-breakdown';

function packs(n: number): string {
  return `${n} pack${n === 1 ? '' : 's'}`;
}

/** The API's plan for a job: volume, doses, and what to take from the van first. */
export function JobPlan({ detail, defaultOpen }: { detail: JobDetail; defaultOpen: boolean }) {
  const { withGallons, toggle } = useGallonsToggle();
  const radiators = detail.survey.radiators.length;
  const completed = detail.job.status === 'completed';
  const summary = `${formatLitres(detail.volume.totalLitres, false)} ${detail.volume.label.toLowerCase()} · ${detail.doses.map((d) => `${d.product.name} ${packs(d.packs)}`).join(', ') || 'no products'}`;
  return (
    <SheetSection title="The plan" summary={summary} defaultOpen={defaultOpen}>
      <div className="space-y-3">
        <h3 className="font-bold text-brand-900">System volume</h3>
        {toggle}
        <VolumeBreakdown volume={detail.volume} withGallons={withGallons} />
      </div>
      <div className="space-y-3 border-t border-line pt-4">
        <h3 className="font-bold text-brand-900">Dose plan</h3>
        <p className="text-ink-muted">{radiators} radiators surveyed.</p>
        {detail.doses.length === 0 ? (
          <p>No products were chosen for this job.</p>
        ) : (
          <ul className="space-y-5">
            {detail.doses.map((dose) => (
              <li key={dose.product.id} className="space-y-2 border-t border-line pt-4 first:border-t-0 first:pt-0">
                <DoseSummary dose={dose} radiators={radiators} withGallons={withGallons} />
                {completed ? null : (
                  <div>
                    <p className="font-semibold">From the van, first expiry first</p>
                    {dose.takeFromVan.length === 0 ? (
                      <p className="text-ink-muted">Nothing to take.</p>
                    ) : (
                      <ul className="list-disc pl-5">
                        {dose.takeFromVan.map((a) => (
                          <li key={a.batchId}>
                            {packs(a.quantity)} of lot <span className="font-mono">{a.lotNumber}</span>, use by{' '}
                            {formatCalendarDate(a.expiresOn)}
                          </li>
                        ))}
                      </ul>
                    )}
                    {dose.shortfall > 0 ? (
                      <p role="alert" className="mt-2 rounded-md bg-danger-50 px-3 py-2 font-semibold text-danger-700">
                        The van is {packs(dose.shortfall)} short of {dose.product.name}. Restock it before the job.
                      </p>
                    ) : null}
                  </div>
                )}
              </li>
            ))}
          </ul>
        )}
      </div>
    </SheetSection>
  );
}
