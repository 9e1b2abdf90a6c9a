import { daysBetween, documentNumber, formatPence, type ReminderKind } from '@heatfleet/domain';
import type { Knex } from 'knex';
import { ukCalendarDate } from '../jobs/report-format.ts';
import { insertEmail } from '../mail/mail-dal.ts';
import { findInvoice } from './invoice-dal.ts';
import { invoicePayLink } from './invoice-payments.ts';
import { listOverdueInvoices } from './invoice-reminder-dal.ts';
import { findFirmForMoney } from './job-lines-dal.ts';
import { findMoneySettings } from './money-settings-dal.ts';

// Overdue invoices, chased through the reminder scan (modules/reminders/reminder-scan.ts): a reminder row per
// invoice per chase ('first' at the firm's first reminder days after the due date, 'second' at the second), so
// each is sent to the customer once; the office digest lists them too.

export interface InvoiceReminderCandidate {
  kind: ReminderKind;
  subjectType: 'invoice';
  subjectId: number;
  periodKey: 'first' | 'second';
  summary: string;
  vanEngineerMemberId: null;
}

export async function overdueInvoiceCandidates(
  trx: Knex.Transaction,
  firmId: number,
  today: string,
): Promise<InvoiceReminderCandidate[]> {
  const settings = await findMoneySettings(trx, firmId);
  if (!settings.saved) return [];
  const rows = await listOverdueInvoices(trx, firmId, today);
  const found: InvoiceReminderCandidate[] = [];
  for (const r of rows) {
    const late = daysBetween(r.due_on, today);
    const which = late >= settings.secondReminderDays ? 'second' : late >= settings.firstReminderDays ? 'first' : null;
    if (!which) continue;
    const owed = Number(r.total_pence) - Number(r.credited_pence) - Number(r.paid_pence);
    found.push({
      kind: 'invoice_overdue',
      subjectType: 'invoice',
      subjectId: r.id,
      periodKey: which,
      summary: `${documentNumber('invoice', r.number)}, ${r.customer_name}: ${formatPence(owed)} overdue since ${r.due_on} (${which} reminder${r.customer_email ? ' e-mailed' : ', no e-mail address'})`,
      vanEngineerMemberId: null,
    });
  }
  return found;
}

/** The customer's reminder with a fresh pay link; null when the invoice has no e-mail address or nothing owed. */
export async function overdueInvoiceEmail(
  trx: Knex.Transaction,
  appOrigin: string,
  firmId: number,
  invoiceId: number,
  which: string,
  now: Date,
): Promise<{ emailId: number; to: string } | null> {
  const inv = await findInvoice(trx, firmId, invoiceId);
  if (!inv?.customer_email || inv.number === null || !inv.due_on) return null;
  const owed = Number(inv.total_pence) - Number(inv.credited_pence) - Number(inv.paid_pence);
  if (owed <= 0) return null;
  const firm = (await findFirmForMoney(trx, firmId))!;
  const link = await invoicePayLink(trx, appOrigin, firmId, invoiceId, now);
  const number = documentNumber('invoice', inv.number);
  const contact = [firm.phone && `call ${firm.phone}`, firm.email && `write to ${firm.email}`].filter(Boolean);
  const text = [
    `Dear ${inv.customer_name},`,
    `${which === 'second' ? 'A second reminder: ' : ''}invoice ${number} from ${firm.name} was due on ${ukCalendarDate(inv.due_on)} and ${formatPence(owed)} is still owed.`,
    `You can pay it online by card here: ${link}`,
    `If you have already paid, thank you, and please ignore this e-mail.${contact.length ? ` If you have any questions, ${contact.join(' or ')}.` : ''}`,
  ].join('\n\n');
  const emailId = await insertEmail(trx, {
    firmId,
    to: inv.customer_email,
    subject: `Reminder: invoice ${number} from ${firm.name} is overdue`,
    text: `${text}\n`,
    html: null,
    purpose: 'invoice',
  });
  return { emailId, to: inv.customer_email };
}
