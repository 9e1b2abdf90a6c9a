import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import type { JobDetail } from '@heatfleet/domain';
import { findFirm } from '../firms/firm-dal.ts';
import { insertEmail } from '../mail/mail-dal.ts';
import { findSite } from '../sites/site-dal.ts';
import { renderReportFor } from './job-report-service.ts';

/**
 * Stores the customer's report (customer-report.ts, never the firm's record) and writes the e-mail that
 * carries it to the customer, in the completion's transaction. A customer without an e-mail address
 * gets none (the report can still be downloaded from the job). The object is written before the row,
 * so an e-mail never points at a missing file; a completion rolled back leaves at most an unreferenced
 * object. With storage down the job still completes and no e-mail is written.
 */
export async function queueJobReportEmail(
  trx: Knex.Transaction,
  deps: AppDeps,
  actor: Actor,
  detail: JobDetail,
): Promise<number | null> {
  const customer = (await findSite(trx, actor.firmId, detail.job.site.id))?.customer;
  if (!customer?.email) return null;
  const firmName = (await findFirm(trx, actor.firmId))?.name ?? '';
  const pdf = await renderReportFor(deps, trx, actor.firmId, detail, 'customer-report');
  const key = `firms/${actor.firmId}/reports/job-${detail.job.id}-${randomUUID()}.pdf`;
  try {
    await deps.objectStore.put(key, pdf, 'application/pdf');
  } catch (err) {
    // The job is done on site whatever the storage does: complete it, keep the report downloadable
    // from the job, and log that the customer's copy was not sent.
    deps.logger.warn({ err, jobId: detail.job.id }, 'completion report not e-mailed: object storage unavailable');
    return null;
  }
  const lines = [
    `Dear ${customer.name},`,
    `${firmName} has completed the cleaning of your heating system at ${detail.job.site.address}. The report is attached.`,
    detail.job.nextCheckOn ? `The inhibitor should be checked again by ${detail.job.nextCheckOn}.` : '',
  ].filter(Boolean);
  return insertEmail(trx, {
    firmId: actor.firmId,
    to: customer.email,
    subject: `Your heating system cleaning report from ${firmName}`,
    text: `${lines.join('\n\n')}\n`,
    html: null,
    purpose: 'job-report',
    attachment: { key, filename: `cleaning-report-${detail.job.id}.pdf` },
  });
}
