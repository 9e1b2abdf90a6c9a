import { subject } from '@casl/ability';
import { useQuery } from '@tanstack/react-query';
import { Link, useParams } from 'react-router-dom';
import { visitKindLabels, type JobDetail } from '@heatfleet/domain';
import { buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { paths } from '@/config/paths';
import { useAbility } from '@/lib/ability';
import { sessionQueries } from '@/lib/auth';
import { formatCalendarDate, formatDateTime } from '@/lib/format';
import { useJobDetail } from '@/features/jobs/api/use-job-detail';
import { AutosaveProvider } from '@/features/jobs/components/autosave-context';
import { CancelJobForm } from '@/features/jobs/components/cancel-job-form';
import { ChemicalsUsed } from '@/features/jobs/components/chemicals-used';
import { SignedLine } from '@/features/jobs/components/customer-signature';
import { CompleteJobPanel } from '@/features/jobs/components/complete-job-panel';
import { JobPlan } from '@/features/jobs/components/job-plan';
import { JobSheetSections } from '@/features/jobs/components/job-sheet';
import { JobStatusBadge } from '@/features/jobs/components/job-status-badge';
import { SheetSection } from '@/features/jobs/components/sheet-section';
import { StartVisit, startSummary } from '@/features/jobs/components/start-visit';
import type { InhibitorChoice } from '@/features/jobs/components/water-tests-form';
import { productQueries } from '@/features/stock/api/stock-queries';
import { JobQuoteSection } from '@/features/money/components/job-quote-section';

function visitStarted(detail: JobDetail): boolean {
  const { sheet } = detail;
  return (
    sheet.signatures.length > 0 ||
    sheet.steps.some((s) => s.doneAt) ||
    sheet.radiators.some((r) => r.before || r.after || r.flushedAt || r.agitation)
  );
}

function DoneCard({ detail, timeZone }: { detail: JobDetail; timeZone: string }) {
  const row = detail.job;
  return (
    <Card
      title="Done"
      description={
        row.completedAt
          ? `Completed ${formatDateTime(row.completedAt, timeZone)}${row.reportNumber ? `, report ${row.reportNumber}` : ''}. The sheet below is the record and can no longer change.`
          : undefined
      }
    >
      <div className="space-y-3">
        <h3 className="font-bold text-brand-900">Chemicals used</h3>
        <ChemicalsUsed used={detail.chemicalsUsed} />
        {row.completionReasons.length ? (
          <>
            <h3 className="font-bold text-brand-900">Reasons given for what was not done</h3>
            <ul className="list-disc space-y-1 pl-5">
              {row.completionReasons.map((r) => (
                <li key={r.code}>
                  <span className="font-semibold">{r.label}:</span> {r.reason}
                </li>
              ))}
            </ul>
          </>
        ) : null}
        {detail.sheet.signatures.map((signature) => (
          <SignedLine key={signature.kind} signature={signature} timeZone={timeZone} />
        ))}
        <p>
          Next annual check: <strong>{row.nextCheckOn ? formatCalendarDate(row.nextCheckOn) : 'not set'}</strong>
        </p>
        {row.recommendation ? (
          <p>
            Recommended: <strong>{row.recommendation}</strong>
          </p>
        ) : null}
        <div className="flex flex-col gap-3 sm:flex-row">
          <a
            className={buttonClasses('primary', 'min-h-12 w-full sm:w-auto')}
            href={`/api/jobs/${row.id}/customer-report.pdf`}
            download
          >
            Download the report for the customer (PDF)
          </a>
          <a
            className={buttonClasses('secondary', 'min-h-12 w-full sm:w-auto')}
            href={`/api/jobs/${row.id}/report.pdf`}
            download
          >
            Download the firm&apos;s record (PDF)
          </a>
        </div>
      </div>
    </Card>
  );
}

/** The job sheet: the booking and its plan, the visit in the order of the work, then completion and the report. */
export function JobPage() {
  const id = Number(useParams().id);
  // Not useSignedInMe: at sign-out the session is cleared while this page may still render once (its queued
  // writes change as the phone is wiped), and it then renders nothing rather than failing.
  const me = useQuery(sessionQueries.me()).data;
  const ability = useAbility();
  // With the visit's writes still waiting on the phone laid over it (features/jobs/api/sheet-overlay.ts).
  const job = useJobDetail(id, Number.isInteger(id) && id > 0);
  // Only for the inhibitors' target ranges; the sheet still works (without the live check) if this fails.
  const products = useQuery(productQueries.list());
  if (!me) return null;
  if (job.isPending) return <PageSpinner label="Loading the job…" />;
  if (job.isError) return <QueryErrorNotice error={job.error} onRetry={() => void job.refetch()} />;
  const detail = job.data;
  const row = detail.job;
  const planned = row.status === 'planned';
  const canChange = ability.can(
    'update',
    subject('Job', { firmId: me.activeFirm.id, engineerMemberId: row.engineerMemberId }),
  );
  const inhibitors: InhibitorChoice[] = (products.data ?? [])
    .filter((p) => p.kind === 'inhibitor' && (p.active || p.id === detail.sheet.water.inhibitorProductId))
    .map((p) => ({ id: p.id, name: p.name, targetMin: p.targetMin, targetMax: p.targetMax, targetUnit: p.targetUnit }));
  const timeZone = me.activeFirm.timeZone;
  const started = visitStarted(detail);
  return (
    <>
      <PageHeader title={`Job at ${row.site.address}`}>
        <span className="flex flex-wrap items-center gap-2">
          <span>
            {row.site.customerName} · {formatCalendarDate(row.scheduledOn)}
            {row.scheduledTime ? ` at ${row.scheduledTime}` : ''} · {visitKindLabels[row.visitKind]}
            {row.engineerName ? ` · ${row.engineerName}` : ''}
          </span>
          <JobStatusBadge status={row.status} />
        </span>
      </PageHeader>
      {/* Keyed by the job: moving from one job to another starts with fresh drafts and the radiator list. */}
      <AutosaveProvider key={row.id} jobId={row.id}>
        <div className="space-y-5">
          {row.cancellation ? (
            <Card title="Cancelled">
              <p>
                {formatDateTime(row.cancellation.at, timeZone)}
                {row.cancellation.byName ? ` by ${row.cancellation.byName}` : ''}: {row.cancellation.reason}
              </p>
            </Card>
          ) : null}
          {row.status === 'completed' ? <DoneCard detail={detail} timeZone={timeZone} /> : null}
          <JobPlan detail={detail} defaultOpen={planned && !started} />
          <JobQuoteSection jobId={row.id} />
          {row.status === 'cancelled' ? null : (
            <>
              <SheetSection title="Before you start" summary={startSummary(detail)} defaultOpen={planned}>
                <StartVisit detail={detail} timeZone={timeZone} />
              </SheetSection>
              <JobSheetSections detail={detail} timeZone={timeZone} inhibitors={inhibitors} />
            </>
          )}
          {planned && canChange ? (
            <Card title="Complete the job">
              <CompleteJobPanel detail={detail} timeZone={timeZone} />
            </Card>
          ) : null}
          {planned && canChange ? (
            <SheetSection title="Change the booking" summary="Edit, reschedule or cancel" defaultOpen={false}>
              <Link to={paths.editJob.getHref(row.id)} className={buttonClasses('secondary', 'min-h-12 w-full')}>
                Edit or reschedule the job
              </Link>
              <CancelJobForm jobId={row.id} />
            </SheetSection>
          ) : null}
        </div>
      </AutosaveProvider>
    </>
  );
}
