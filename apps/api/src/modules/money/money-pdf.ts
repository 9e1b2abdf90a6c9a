import { formatPence, formatVatRate, vatByRate, type MoneyLine } from '@heatfleet/domain';
import { ukDate, ukDateTime } from '../jobs/report-format.ts';
import { createReportPdf, HEAD, INK, type ReportPdf } from '../jobs/report-pdf.ts';

// Invoices, credit notes and quotes in the job report's look (report-pdf.ts). What a VAT invoice carries
// follows regulation 14(1) of the Value Added Tax Regulations 1995 (SI 1995/2518): a sequential number,
// the time of supply, the date of issue, the supplier's name, address and VAT registration number, the
// customer's name and address, a description of each supply with its quantity, unit price excluding VAT,
// rate of VAT and amount payable excluding VAT, the total excluding VAT, and the VAT payable at each rate.

export interface MoneyDocument {
  title: string;
  number: string;
  firm: { name: string; address: string | null; phone?: string | null; email?: string | null };
  vatNumber: string | null;
  vatRegistered: boolean;
  timeZone: string;
  customer: { name: string; address: string };
  facts: [label: string, value: string][];
  lines: MoneyLine[];
  totals: { netPence: number; vatPence: number; totalPence: number };
  /** Lines under the totals box, e.g. paid and due, or a pay link. */
  after?: (pdf: ReportPdf) => void;
}

export const when = (d: Date | string, tz: string) => ukDateTime(d, tz);
export const day = (d: Date | string, tz: string) => ukDate(d, tz);

export function drawMoneyDocument(d: MoneyDocument): Promise<Buffer> {
  const pdf = createReportPdf({ title: `${d.title} ${d.number}`, author: d.firm.name });
  const { doc, left } = pdf;
  doc.font('bold').fontSize(16).fillColor(HEAD).text(d.firm.name, left);
  doc.font('body').fontSize(9.5).fillColor(INK);
  if (d.firm.address) doc.text(d.firm.address.replace(/\s*\n\s*/g, ', '));
  const contact = [d.firm.phone && `Phone ${d.firm.phone}`, d.firm.email && `E-mail ${d.firm.email}`].filter(Boolean);
  if (contact.length) doc.text(contact.join('   '));
  if (d.vatRegistered && d.vatNumber) doc.text(`VAT registration number ${d.vatNumber}`);
  doc.moveDown(0.8);
  doc.font('bold').fontSize(18).fillColor(HEAD).text(d.title);
  doc.font('body').fontSize(10).fillColor(INK).text(`Number ${d.number}`);
  pdf.heading('To');
  doc.text(d.customer.name);
  doc.text(d.customer.address.replace(/\s*\n\s*/g, ', '));
  doc.moveDown(0.4);
  for (const [label, value] of d.facts) pdf.line(label, value);
  pdf.heading('Details', 80);
  const vat = d.vatRegistered;
  pdf.table(
    [
      { title: 'Description', width: 40 },
      { title: 'Qty', width: 7, align: 'right' },
      { title: vat ? 'Unit price excl. VAT' : 'Unit price', width: 15, align: 'right' },
      ...(vat ? [{ title: 'VAT rate', width: 10, align: 'right' as const }] : []),
      { title: vat ? 'Amount excl. VAT' : 'Amount', width: 15, align: 'right' },
      ...(vat ? [{ title: 'VAT', width: 12, align: 'right' as const }] : []),
    ],
    d.lines.map((l) => [
      l.description,
      String(l.quantity),
      formatPence(l.unitPence),
      ...(vat ? [formatVatRate(l.vatRateBp)] : []),
      formatPence(l.netPence),
      ...(vat ? [formatPence(l.vatPence)] : []),
    ]),
  );
  const rows: [string, string][] = vat
    ? [
        ['Total excluding VAT', formatPence(d.totals.netPence)],
        ...vatByRate(d.lines).map((r): [string, string] => [
          `VAT at ${formatVatRate(r.vatRateBp)}`,
          formatPence(r.vatPence),
        ]),
        ['Total', formatPence(d.totals.totalPence)],
      ]
    : [['Total', formatPence(d.totals.totalPence)]];
  pdf.box(vat ? 'Totals' : 'Total (no VAT is charged: the firm is not registered for VAT)', rows);
  d.after?.(pdf);
  return pdf.finish((page, pages) => `${d.title} ${d.number} · page ${page} of ${pages}`);
}
