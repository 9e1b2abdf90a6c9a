import type { Knex } from 'knex';
import {
  calendarDateIn,
  cancellationInformation,
  documentNumber,
  modelCancellationForm,
  type PublicQuote,
  type Quote,
} from '@heatfleet/domain';
import { findFirmForMoney, findJobParties } from './job-lines-dal.ts';
import { listLines } from './money-line-dal.ts';
import { findMoneySettings } from './money-settings-dal.ts';
import type { QuoteRow } from './quote-dal.ts';

type Db = Knex | Knex.Transaction;
const iso = (d: Date | null) => (d === null ? null : new Date(d).toISOString());

/** A quote has expired once its validity date has passed in the firm's zone (an answer already given stands). */
export function quoteExpired(row: QuoteRow, timeZone: string, now: Date): boolean {
  return (row.status === 'draft' || row.status === 'sent') && row.valid_until < calendarDateIn(now, timeZone);
}

export async function quoteAnswer(db: Db, firmId: number, row: QuoteRow, now: Date): Promise<Quote> {
  const [lines, parties] = await Promise.all([
    listLines(db, 'quote_lines', firmId, [row.id]),
    findJobParties(db, firmId, row.job_id),
  ]);
  return {
    id: row.id,
    number: documentNumber('quote', row.number),
    jobId: row.job_id,
    customerName: parties?.customerName ?? '',
    siteAddress: [parties?.siteAddress, parties?.sitePostcode].filter(Boolean).join(', '),
    status: row.status,
    expired: quoteExpired(row, parties?.timeZone ?? 'Europe/London', now),
    validUntil: row.valid_until,
    vatRegistered: Boolean(row.vat_registered),
    notes: row.notes,
    lines: lines.get(row.id) ?? [],
    netPence: Number(row.net_pence),
    vatPence: Number(row.vat_pence),
    totalPence: Number(row.total_pence),
    sentAt: iso(row.sent_at),
    acceptance:
      row.accepted_at && row.accepted_name && row.accepted_via
        ? {
            name: row.accepted_name,
            at: iso(row.accepted_at)!,
            via: row.accepted_via,
            expressRequest: Boolean(row.express_request),
            hasSignature: !!row.signature_key,
          }
        : null,
    declinedAt: iso(row.declined_at),
    declineReason: row.decline_reason,
    createdAt: iso(row.created_at)!,
  };
}

/** What the customer's link shows: the quote, who it is from, and the cancellation information and form. */
export async function publicQuoteAnswer(db: Db, row: QuoteRow, now: Date): Promise<PublicQuote> {
  const q = await quoteAnswer(db, row.firm_id, row, now);
  const firm = (await findFirmForMoney(db, row.firm_id))!;
  const settings = await findMoneySettings(db, row.firm_id);
  const f = { name: firm.name, address: firm.address, phone: firm.phone, email: firm.email };
  return {
    number: q.number,
    firmName: firm.name,
    firmAddress: firm.address,
    firmPhone: firm.phone,
    firmEmail: firm.email,
    vatNumber: q.vatRegistered ? settings.vatNumber : null,
    customerName: q.customerName,
    siteAddress: q.siteAddress,
    status: q.status,
    expired: q.expired,
    validUntil: q.validUntil,
    vatRegistered: q.vatRegistered,
    notes: q.notes,
    lines: q.lines.map(({ id: _id, priceItemId: _p, productId: _pr, ...l }) => l),
    netPence: q.netPence,
    vatPence: q.vatPence,
    totalPence: q.totalPence,
    cancellation: { information: cancellationInformation(f), modelForm: modelCancellationForm(f, q.number) },
    acceptance: q.acceptance && {
      name: q.acceptance.name,
      at: q.acceptance.at,
      expressRequest: q.acceptance.expressRequest,
    },
  };
}
