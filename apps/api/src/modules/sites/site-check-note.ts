import type { InhibitorVisitOutcome } from '@heatfleet/domain';
import type { Knex } from 'knex';
import { insertEmail } from '../mail/mail-dal.ts';
import { findReportFirm } from '../jobs/job-report-dal.ts';
import { ukCalendarDate } from '../jobs/report-format.ts';

export interface CheckNoteFacts {
  firmId: number;
  to: string;
  customerName: string;
  address: string;
  checkedOn: string;
  productName: string;
  range: { min: number; max: number; unit: string | null };
  firstReading: number;
  topUpPacks: number | null;
  retestReading: number | null;
  outcome: InhibitorVisitOutcome;
}

const where = (reading: number, range: CheckNoteFacts['range']) =>
  reading < range.min
    ? 'below the target range'
    : reading > range.max
      ? 'above the target range'
      : 'within the target range';

/**
 * The customer's short note of an inhibitor check visit: the reading against the product's range, any
 * top-up and re-test, and when the next check falls, with UK dates ("3 December 2026", as the reports
 * print them). Written in the visit's transaction; queued after commit by the caller.
 */
export async function writeCheckNote(trx: Knex.Transaction, f: CheckNoteFacts): Promise<number> {
  const firm = await findReportFirm(trx, f.firmId);
  const firmName = firm?.name ?? 'Your heating engineer';
  const unit = f.range.unit ? ` ${f.range.unit}` : '';
  const address = f.address.replace(/\s*\n\s*/g, ', ');
  const passed = f.outcome.result === 'pass';
  const contact = [firm?.phone && `call ${firm.phone}`, firm?.email && `write to ${firm.email}`].filter(Boolean);
  const lines = [
    `Dear ${f.customerName},`,
    `${firmName} checked the inhibitor in your heating system at ${address} on ${ukCalendarDate(f.checkedOn)}.`,
    `${f.productName}: ${f.firstReading}${unit}, ${where(f.firstReading, f.range)} (${f.range.min} to ${f.range.max}${unit}).`,
    f.topUpPacks
      ? `We topped up the inhibitor (${f.topUpPacks} pack${f.topUpPacks === 1 ? '' : 's'})${f.retestReading === null ? '.' : ` and tested again: ${f.retestReading}${unit}, ${where(f.retestReading, f.range)}.`}`
      : f.retestReading !== null
        ? `We tested again: ${f.retestReading}${unit}, ${where(f.retestReading, f.range)}.`
        : '',
    passed
      ? `Result: your system is protected. The next check is due by ${ukCalendarDate(f.outcome.nextCheckOn)}.`
      : `Result: the inhibitor is not yet at its target, so your system is not fully protected. We will check it again by ${ukCalendarDate(f.outcome.nextCheckOn)}.`,
    contact.length ? `If you have any questions, ${contact.join(' or ')}.` : '',
  ].filter(Boolean);
  return insertEmail(trx, {
    firmId: f.firmId,
    to: f.to,
    subject: `Inhibitor check ${passed ? 'passed' : 'needs a follow-up'}: ${firmName}`,
    text: `${lines.join('\n\n')}\n`,
    html: null,
    purpose: 'site-check',
  });
}
