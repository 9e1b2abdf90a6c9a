import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import type { JobDetail } from '@heatfleet/domain';
import { insertEmail } from '../mail/mail-dal.ts';
import { findSite } from '../sites/site-dal.ts';
import { findReportFirm } from './job-report-dal.ts';
import { renderReportFor } from './job-report-service.ts';
import { ukCalendarDate } from './report-format.ts';

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
  const firm = await findReportFirm(trx, actor.firmId);
  const firmName = firm?.name ?? '';
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
  const { job } = detail;
  const work = job.visitKind === 'inhibitor_only' ? 'the inhibitor visit to' : 'the cleaning of';
  const contact = [firm?.phone && `call ${firm.phone}`, firm?.email && `write to ${firm.email}`].filter(Boolean);
  const lines = [
    `Dear ${customer.name},`,
    `${firmName} has completed ${work} your heating system at ${job.site.address.replace(/\s*\n\s*/g, ', ')}. The report is attached${job.reportNumber ? ` (report number ${job.reportNumber})` : ''}.`,
    job.nextCheckOn ? `The inhibitor should be checked again by ${ukCalendarDate(job.nextCheckOn)}.` : '',
    contact.length ? `If you have any questions, ${contact.join(' or ')}.` : '',
  ].filter(Boolean);
  return insertEmail(trx, {
    firmId: actor.firmId,
    to: customer.email,
    subject: `Your heating system ${job.visitKind === 'inhibitor_only' ? 'inhibitor' : 'cleaning'} report${job.reportNumber ? ` ${job.reportNumber}` : ''} from ${firmName}`,
    text: `${lines.join('\n\n')}\n`,
    html: null,
    purpose: 'job-report',
    attachment: { key, filename: `cleaning-report-${detail.job.id}.pdf` },
  });
}
