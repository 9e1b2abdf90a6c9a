import { ForbiddenError } from '@casl/ability';
import type { JobDetail } from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { renderCustomerReport } from './customer-report.ts';
import { renderFirmRecord } from './firm-record.ts';
import { loadReportData } from './job-report-data.ts';
import { getJob } from './job-service.ts';

/** The two documents of a job: the firm's own record (everything) and the customer's report (what is e-mailed). */
export type ReportKind = 'firm-record' | 'customer-report';

/** A job's document, its data read through `db` (the completion's transaction, if any). */
export async function renderReportFor(
  deps: AppDeps,
  db: Knex | Knex.Transaction,
  firmId: number,
  detail: JobDetail,
  kind: ReportKind,
): Promise<Buffer> {
  const data = await loadReportData(deps, db, firmId, detail);
  return kind === 'customer-report' ? renderCustomerReport(data) : renderFirmRecord(data);
}

/** A job's document as a PDF, for download. */
export async function jobReportPdf(deps: AppDeps, actor: Actor, jobId: number, kind: ReportKind): Promise<Buffer> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Job');
  return renderReportFor(deps, deps.db, actor.firmId, await getJob(deps, actor, jobId), kind);
}
