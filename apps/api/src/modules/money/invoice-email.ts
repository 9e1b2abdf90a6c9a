import { randomUUID } from 'node:crypto';
import { formatPence } from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { AppDeps } from '../../app-deps.ts';
import { ukCalendarDate } from '../jobs/report-format.ts';
import { insertEmail } from '../mail/mail-dal.ts';
import { invoiceAnswer } from './invoice-answer.ts';
import { findInvoice } from './invoice-dal.ts';
import { invoicePayLink } from './invoice-payments.ts';
import { invoicePdf } from './invoice-pdf.ts';
import { findFirmForMoney } from './job-lines-dal.ts';

/**
 * The issued invoice to the customer, in the issuing transaction: the PDF stored first (as the job report
 * is, job-report-email.ts), then the e-mail row with a pay link of its own. No e-mail address, or storage
 * down: no e-mail (the invoice is issued all the same and can be sent again from its page).
 */
export async function queueInvoiceEmail(
  trx: Knex.Transaction,
  deps: AppDeps,
  firmId: number,
  invoiceId: number,
): Promise<number | null> {
  const row = await findInvoice(trx, firmId, invoiceId);
  if (!row?.customer_email || row.number === null) return null;
  const inv = await invoiceAnswer(trx, firmId, row);
  const firm = (await findFirmForMoney(trx, firmId))!;
  const link = await invoicePayLink(trx, deps.env.APP_ORIGIN, firmId, invoiceId, deps.clock.now());
  const pdf = await invoicePdf(inv, firm.time_zone, link);
  const key = `firms/${firmId}/invoices/invoice-${invoiceId}-${randomUUID()}.pdf`;
  try {
    await deps.objectStore.put(key, pdf, 'application/pdf');
  } catch (err) {
    deps.logger.warn({ err, invoiceId }, 'invoice not e-mailed: object storage unavailable');
    return null;
  }
  const contact = [firm.phone && `call ${firm.phone}`, firm.email && `write to ${firm.email}`].filter(Boolean);
  const lines = [
    `Dear ${inv.customerName},`,
    `Please find attached invoice ${inv.number} from ${inv.firmName} for ${formatPence(inv.totalPence)}${inv.dueOn ? `, due by ${ukCalendarDate(inv.dueOn)}` : ''}.`,
    inv.duePence > 0 ? `You can pay it online by card here: ${link}` : '',
    contact.length ? `If you have any questions, ${contact.join(' or ')}.` : '',
  ].filter(Boolean);
  return insertEmail(trx, {
    firmId,
    to: row.customer_email,
    subject: `Invoice ${inv.number} from ${inv.firmName}`,
    text: `${lines.join('\n\n')}\n`,
    html: null,
    purpose: 'invoice',
    attachment: { key, filename: `invoice-${inv.number}.pdf` },
  });
}
