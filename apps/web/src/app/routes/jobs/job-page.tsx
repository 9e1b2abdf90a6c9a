import { subject } from '@casl/ability';
import { useQuery } from '@tanstack/react-query';
import { useParams } from 'react-router-dom';
import { Badge } from '@/components/ui/badge';
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

export function JobPage() {
  const id = Number(useParams().id);
  const me = useSignedInMe();
  const ability = useAbility();
  const job = useQuery({ ...jobQueries.detail(id), enabled: Number.isInteger(id) && id > 0 });
  if (job.isPending) return <PageSpinner label="Loading the job…" />;
  if (job.isError) return <QueryErrorNotice error={job.error} onRetry={() => void job.refetch()} />;
  const { job: row } = job.data;
  const completed = row.status === 'completed';
  const canComplete = ability.can('update', subject('Job', { firmId: me.activeFirm.id, engineerMemberId: row.engineerMemberId }));
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
        <JobPlan detail={job.data} />
        <JobCautions />
        {completed ? (
          <Card title="Done" description={row.completedAt ? `Completed ${formatDateTime(row.completedAt, me.activeFirm.timeZone)}.` : undefined}>
            <div className="space-y-3">
              <h3 className="font-bold text-brand-900">Chemicals used</h3>
              <ChemicalsUsed used={job.data.chemicalsUsed} />
              <p>
                Next annual check: <strong>{row.nextCheckOn ? formatCalendarDate(row.nextCheckOn) : 'not set'}</strong>
              </p>
              <p>
                <a className="inline-flex min-h-11 items-center font-semibold text-brand-700 underline" href={`/api/jobs/${row.id}/report.pdf`} download>
                  Download the completion report (PDF)
                </a>
              </p>
            </div>
          </Card>
        ) : canComplete ? (
          <Card title="Complete the job">
            <CompleteJobPanel detail={job.data} />
          </Card>
        ) : null}
      </div>
    </>
  );
}
