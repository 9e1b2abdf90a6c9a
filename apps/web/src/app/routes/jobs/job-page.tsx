import { subject } from '@casl/ability';
import { useQuery } from '@tanstack/react-query';
import { useParams } from 'react-router-dom';
import { Badge } from '@/components/ui/badge';
import { buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { useAbility } from '@/lib/ability';
import { useSignedInMe } from '@/lib/auth';
import { formatCalendarDate, formatDateTime } from '@/lib/format';
import { jobQueries } from '@/features/jobs/api/job-queries';
import { ChemicalsUsed } from '@/features/jobs/components/chemicals-used';
import { CompleteJobPanel } from '@/features/jobs/components/complete-job-panel';
import { JobCautions } from '@/features/jobs/components/job-cautions';
import { JobPlan } from '@/features/jobs/components/job-plan';
import { JobSheetSections } from '@/features/jobs/components/job-sheet';
import type { InhibitorChoice } from '@/features/jobs/components/water-tests-form';
import { productQueries } from '@/features/stock/api/stock-queries';

/** The job sheet: the plan, then the visit section by section, then completion and the report. */
export function JobPage() {
  const id = Number(useParams().id);
  const me = useSignedInMe();
  const ability = useAbility();
  const job = useQuery({ ...jobQueries.detail(id), enabled: Number.isInteger(id) && id > 0 });
  // Only for the inhibitors' target ranges; the sheet still works (without the live check) if this fails.
  const products = useQuery(productQueries.list());
  if (job.isPending) return <PageSpinner label="Loading the job…" />;
  if (job.isError) return <QueryErrorNotice error={job.error} onRetry={() => void job.refetch()} />;
  const { job: row } = job.data;
  const completed = row.status === 'completed';
  const canComplete = ability.can(
    'update',
    subject('Job', { firmId: me.activeFirm.id, engineerMemberId: row.engineerMemberId }),
  );
  const inhibitors: InhibitorChoice[] = (products.data ?? [])
    .filter((p) => p.kind === 'inhibitor' && (p.active || p.id === job.data.sheet.water.inhibitorProductId))
    .map((p) => ({ id: p.id, name: p.name, targetMin: p.targetMin, targetMax: p.targetMax, targetUnit: p.targetUnit }));
  const timeZone = me.activeFirm.timeZone;
  return (
    <>
      <PageHeader title={`Job at ${row.site.address}`}>
        <span className="flex flex-wrap items-center gap-2">
          <span>
            {row.site.customerName} · {formatCalendarDate(row.scheduledOn)}
          </span>
          {completed ? <Badge tone="ok">Completed</Badge> : <Badge tone="neutral">Booked</Badge>}
        </span>
      </PageHeader>
      <div className="space-y-5">
        {completed ? (
          <Card
            title="Done"
            description={
              row.completedAt
                ? `Completed ${formatDateTime(row.completedAt, timeZone)}. The sheet below is the record and can no longer change.`
                : undefined
            }
          >
            <div className="space-y-3">
              <h3 className="font-bold text-brand-900">Chemicals used</h3>
              <ChemicalsUsed used={job.data.chemicalsUsed} />
              <p>
                Next annual check: <strong>{row.nextCheckOn ? formatCalendarDate(row.nextCheckOn) : 'not set'}</strong>
              </p>
              <p>
                <a
                  className={buttonClasses('primary', 'min-h-12 w-full sm:w-auto')}
                  href={`/api/jobs/${row.id}/report.pdf`}
                  download
                >
                  Download the report (PDF)
                </a>
              </p>
            </div>
          </Card>
        ) : null}
        <JobPlan detail={job.data} />
        {completed ? null : <JobCautions />}
        <JobSheetSections detail={job.data} timeZone={timeZone} inhibitors={inhibitors} />
        {!completed && canComplete ? (
          <Card title="Complete the job">
            <CompleteJobPanel detail={job.data} />
          </Card>
        ) : null}
      </div>
    </>
  );
}
