import { EXPRESS_REQUEST_WORDS, type PublicQuote } from '@heatfleet/domain';
import { ukCalendarDate } from '../jobs/report-format.ts';
import { day, drawMoneyDocument } from './money-pdf.ts';

/** The quote with the cancellation information and the model cancellation form (Consumer Contracts Regulations 2013, Schedule 3). */
export function quotePdf(q: PublicQuote, timeZone: string, link: string | null): Promise<Buffer> {
  return drawMoneyDocument({
    title: 'Quote',
    number: q.number,
    firm: { name: q.firmName, address: q.firmAddress, phone: q.firmPhone, email: q.firmEmail },
    vatNumber: q.vatNumber,
    vatRegistered: q.vatRegistered,
    timeZone,
    customer: { name: q.customerName, address: q.siteAddress },
    facts: [
      ['Valid until', ukCalendarDate(q.validUntil)],
      ...(q.acceptance
        ? [
            ['Accepted by', `${q.acceptance.name} on ${day(q.acceptance.at, timeZone)}`] as [string, string],
            [
              'Work within the cancellation period',
              q.acceptance.expressRequest ? 'Requested by the customer' : 'Not requested',
            ] as [string, string],
          ]
        : []),
    ],
    lines: q.lines.map((l, i) => ({ ...l, id: i, priceItemId: null, productId: null })),
    totals: q,
    after: (pdf) => {
      if (q.notes) pdf.line('Notes', q.notes);
      if (link) pdf.line('Accept or decline online', link);
      pdf.heading('Your right to cancel', 120);
      for (const para of q.cancellation.information) pdf.doc.fontSize(9.5).text(para).moveDown(0.3);
      pdf.doc.moveDown(0.3).font('bold').text('Work within the cancellation period').font('body');
      pdf.doc.text(
        `If you want the work done within the cancellation period, tick the box when you accept: "${EXPRESS_REQUEST_WORDS}"`,
      );
      pdf.heading('Model cancellation form', 160);
      for (const para of q.cancellation.modelForm) pdf.doc.fontSize(9.5).text(para).moveDown(0.6);
    },
  });
}
