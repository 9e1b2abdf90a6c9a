import { ForbiddenError } from '@casl/ability';
import { addDays, addMonths, calendarDateIn, documentNumber, type MoneyOverview } from '@heatfleet/domain';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { ruleBroken } from '../../lib/http-error.ts';
import { toCsv, type CsvCell } from '../../lib/csv.ts';
import { startOfDayIn } from '../overview/overview-service.ts';
import { findFirmForMoney } from './job-lines-dal.ts';
import {
  agedDebt,
  creditNotesBetween,
  invoicedByMonth,
  invoicesIssuedBetween,
  receiptsBetween,
} from './money-report-dal.ts';

/** Pence as a number of pounds for a spreadsheet: built from the integer's digits, so it prints exactly. */
export function pounds(pence: number): number {
  const abs = Math.abs(pence);
  return Number(`${pence < 0 ? '-' : ''}${Math.floor(abs / 100)}.${String(abs % 100).padStart(2, '0')}`);
}

/** The owner's money figures: owed and aged, invoices overdue, and 12 months of invoiced revenue (net of credit notes). */
export async function moneyOverview(deps: AppDeps, actor: Actor): Promise<MoneyOverview> {
  ForbiddenError.from(actor.ability).throwUnlessCan('update', 'Invoice');
  const firm = (await findFirmForMoney(deps.db, actor.firmId))!;
  const now = deps.clock.now();
  const today = calendarDateIn(now, firm.time_zone);
  const firstMonth = `${addMonths(today, -11).slice(0, 7)}-01`;
  const [debt, invoiced, credits] = await Promise.all([
    agedDebt(deps.db, actor.firmId, today),
    invoicedByMonth(deps.db, actor.firmId, firstMonth),
    creditNotesBetween(deps.db, actor.firmId, startOfDayIn(firstMonth, firm.time_zone), now),
  ]);
  const months = Array.from({ length: 12 }, (_, i) => addMonths(firstMonth, i).slice(0, 7));
  const byMonth = new Map(months.map((m) => [m, { month: m, netPence: 0, totalPence: 0 }]));
  for (const r of invoiced) {
    const m = byMonth.get(r.month);
    if (m) {
      m.netPence += Number(r.net);
      m.totalPence += Number(r.total);
    }
  }
  for (const c of credits) {
    const m = byMonth.get(calendarDateIn(new Date(c.issued_at), firm.time_zone).slice(0, 7));
    if (m) {
      m.netPence -= Number(c.net_pence);
      m.totalPence -= Number(c.total_pence);
    }
  }
  return { ...debt, revenueByMonth: [...byMonth.values()] };
}

const COLUMNS = [
  'Type',
  'Number',
  'Date',
  'Tax point',
  'Customer',
  'Net',
  'VAT',
  'Total',
  'Reference',
  'Status',
] as const;

/**
 * Invoices (by invoice date), credit notes and payments (by when they happened) in a date range of the firm's
 * calendar, dates in the firm's zone, as formula-safe CSV (lib/csv.ts). Credit notes and refunds are negative.
 */
export async function moneyExportCsv(deps: AppDeps, actor: Actor, from: string, to: string): Promise<string> {
  ForbiddenError.from(actor.ability).throwUnlessCan('update', 'Invoice');
  if (to < from)
    throw ruleBroken('The end of the range must not be before its start.', [
      { path: 'to', message: 'Before the start.' },
    ]);
  if (addDays(from, 366) < to)
    throw ruleBroken('Export at most a year at a time.', [
      { path: 'to', message: 'More than a year after the start.' },
    ]);
  const firm = (await findFirmForMoney(deps.db, actor.firmId))!;
  const tz = firm.time_zone;
  const start = startOfDayIn(from, tz);
  const end = startOfDayIn(addDays(to, 1), tz);
  const [invoices, credits, receipts] = await Promise.all([
    invoicesIssuedBetween(deps.db, actor.firmId, from, to),
    creditNotesBetween(deps.db, actor.firmId, start, end),
    receiptsBetween(deps.db, actor.firmId, start, end),
  ]);
  const day = (d: Date) => calendarDateIn(new Date(d), tz);
  const inv = (n: number | null) => (n === null ? '' : documentNumber('invoice', n));
  const rows: CsvCell[][] = [
    ...invoices.map((i) => [
      'Invoice',
      inv(i.number),
      i.issued_on,
      i.supplied_at ? day(i.supplied_at) : '',
      i.customer_name,
      pounds(Number(i.net_pence)),
      pounds(Number(i.vat_pence)),
      pounds(Number(i.total_pence)),
      i.job_id ? `Job ${i.job_id}` : '',
      i.status,
    ]),
    ...credits.map((c) => [
      'Credit note',
      documentNumber('credit_note', c.number),
      day(c.issued_at),
      day(c.issued_at),
      c.customer_name,
      pounds(-Number(c.net_pence)),
      pounds(-Number(c.vat_pence)),
      pounds(-Number(c.total_pence)),
      `Credits ${inv(c.invoice_number)}: ${c.reason}`,
      '',
    ]),
    ...receipts.map((r) => [
      Number(r.amount_pence) < 0 ? 'Refund' : 'Payment',
      r.payment_ref,
      day(r.received_at),
      '',
      r.customer_name,
      '',
      '',
      pounds(Number(r.amount_pence)),
      inv(r.invoice_number),
      '',
    ]),
  ];
  return toCsv([...COLUMNS], rows);
}
