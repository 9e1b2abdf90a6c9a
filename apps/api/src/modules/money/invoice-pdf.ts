import { documentNumber, formatPence, VAT_ROUNDING_RULE, type CreditNote, type Invoice } from '@heatfleet/domain';
import { ukCalendarDate } from '../jobs/report-format.ts';
import { day, drawMoneyDocument, when } from './money-pdf.ts';

export function invoicePdf(inv: Invoice, timeZone: string, payLink?: string): Promise<Buffer> {
  const issued = inv.status !== 'draft';
  return drawMoneyDocument({
    title: issued ? (inv.vatRegistered ? 'VAT invoice' : 'Invoice') : 'Draft invoice (not issued)',
    number: inv.number ?? 'not yet numbered',
    firm: { name: inv.firmName, address: inv.firmAddress },
    vatNumber: inv.vatNumber,
    vatRegistered: inv.vatRegistered,
    timeZone,
    customer: { name: inv.customerName, address: inv.customerAddress },
    facts: [
      ...(inv.issuedAt ? [['Date of issue', day(inv.issuedAt, timeZone)] as [string, string]] : []),
      ...(inv.suppliedAt ? [['Time of supply', when(inv.suppliedAt, timeZone)] as [string, string]] : []),
      ...(inv.dueOn ? [['Payment due by', ukCalendarDate(inv.dueOn)] as [string, string]] : []),
    ],
    lines: inv.lines,
    totals: inv,
    after: (pdf) => {
      if (inv.creditedPence) pdf.line('Credited', formatPence(inv.creditedPence));
      if (inv.paidPence) pdf.line('Paid', formatPence(inv.paidPence));
      if (issued) pdf.line('Amount due', formatPence(inv.duePence));
      if (payLink && inv.duePence > 0) pdf.line('Pay online', payLink);
      if (inv.vatRegistered) pdf.doc.moveDown(0.5).fontSize(8.5).text(`Rounding: ${VAT_ROUNDING_RULE}.`);
    },
  });
}

export function creditNotePdf(note: CreditNote, inv: Invoice, timeZone: string): Promise<Buffer> {
  return drawMoneyDocument({
    title: inv.vatRegistered ? 'VAT credit note' : 'Credit note',
    number: note.number,
    firm: { name: inv.firmName, address: inv.firmAddress },
    vatNumber: inv.vatNumber,
    vatRegistered: inv.vatRegistered,
    timeZone,
    customer: { name: inv.customerName, address: inv.customerAddress },
    facts: [
      ['Date of issue', day(note.issuedAt, timeZone)],
      ['Credits invoice', inv.number ?? documentNumber('invoice', 0)],
      ['Reason', note.reason],
    ],
    lines: note.lines,
    totals: note,
  });
}
