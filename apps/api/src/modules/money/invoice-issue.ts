import { addDays, calendarDateIn, priceLines, type MoneyLineInput } from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { AppDeps } from '../../app-deps.ts';
import { conflict, notFound } from '../../lib/http-error.ts';
import { findJobRow } from '../jobs/job-dal.ts';
import { findInvoice, findInvoiceForJob, insertInvoice, markInvoiceIssued, updateDraftInvoice } from './invoice-dal.ts';
import { queueInvoiceEmail } from './invoice-email.ts';
import { priceListLinesForJob } from './job-lines.ts';
import { findFirmForMoney, findJobParties } from './job-lines-dal.ts';
import { deleteLines, insertLines, listLines } from './money-line-dal.ts';
import { findMoneySettings, takeNextNumber } from './money-settings-dal.ts';
import { findAcceptedQuoteForJob } from './quote-dal.ts';

// Invoices inside a caller's transaction: made from a job (as a draft), lines replaced while a draft,
// issued (number, tax point, the firm's and customer's details copied), at completion or by hand.

export const ISSUED_MESSAGE = 'An issued invoice cannot be changed. Raise a credit note to correct it.';

function addressOf(p: { siteAddress: string; sitePostcode: string | null }) {
  return [p.siteAddress, p.sitePostcode].filter(Boolean).join('\n');
}

/** What the job's invoice carries: the accepted quote's lines as agreed, else the price list's. */
export async function linesForJobInvoice(trx: Knex.Transaction, deps: AppDeps, firmId: number, jobId: number) {
  const row = await findJobRow(trx, firmId, jobId);
  if (!row) throw notFound('That job');
  const quote = await findAcceptedQuoteForJob(trx, firmId, jobId);
  if (quote) {
    const lines = (await listLines(trx, 'quote_lines', firmId, [quote.id])).get(quote.id) ?? [];
    return {
      row,
      quoteId: quote.id,
      lines: lines.map((l): MoneyLineInput => ({
        kind: l.kind,
        priceItemId: l.priceItemId,
        productId: l.productId,
        description: l.description,
        quantity: l.quantity,
        unitPence: l.unitPence,
      })),
    };
  }
  return { row, quoteId: null, lines: await priceListLinesForJob(trx, deps, firmId, row) };
}

/** Prices the lines by the firm's VAT settings and stores them (replacing any), with the totals. */
async function writeLines(trx: Knex.Transaction, firmId: number, invoiceId: number, lines: MoneyLineInput[]) {
  const settings = await findMoneySettings(trx, firmId);
  const priced = priceLines(
    lines.map((l) => ({ ...l, vatRateBp: settings.vatRateBp })),
    settings.vatRegistered,
  );
  await deleteLines(trx, 'invoice_lines', firmId, invoiceId);
  await insertLines(
    trx,
    'invoice_lines',
    firmId,
    invoiceId,
    priced.lines.map((l, i) => ({
      ...l,
      kind: lines[i]!.kind,
      priceItemId: lines[i]!.priceItemId,
      productId: lines[i]!.productId,
    })),
  );
  await updateDraftInvoice(trx, firmId, invoiceId, {
    net_pence: priced.totals.netPence,
    vat_pence: priced.totals.vatPence,
    total_pence: priced.totals.totalPence,
  });
}

/** A draft invoice for a job (one invoice per job: 409 if it has one). */
export async function createDraftForJob(
  trx: Knex.Transaction,
  deps: AppDeps,
  firmId: number,
  userId: number | null,
  jobId: number,
  lines?: MoneyLineInput[],
): Promise<number> {
  const built = await linesForJobInvoice(trx, deps, firmId, jobId);
  if (await findInvoiceForJob(trx, firmId, jobId)) throw conflict('This job already has an invoice.');
  const parties = (await findJobParties(trx, firmId, jobId))!;
  const settings = await findMoneySettings(trx, firmId);
  const id = await insertInvoice(trx, {
    firm_id: firmId,
    job_id: jobId,
    quote_id: built.quoteId,
    customer_id: parties.customerId,
    number: null,
    status: 'draft',
    supplied_at: null,
    issued_at: null,
    issued_on: null,
    due_on: null,
    firm_name: parties.firmName,
    firm_address: parties.firmAddress,
    vat_number: settings.vatRegistered ? settings.vatNumber : null,
    vat_registered: settings.vatRegistered,
    customer_name: parties.customerName,
    customer_address: addressOf(parties),
    customer_email: parties.customerEmail,
    net_pence: 0,
    vat_pence: 0,
    total_pence: 0,
    created_by_user_id: userId,
  });
  await writeLines(trx, firmId, id, lines ?? built.lines);
  return id;
}

export async function replaceDraftLines(trx: Knex.Transaction, firmId: number, id: number, lines: MoneyLineInput[]) {
  const row = await findInvoice(trx, firmId, id, { forUpdate: true });
  if (!row) throw notFound('That invoice');
  if (row.status !== 'draft') throw conflict(ISSUED_MESSAGE);
  await writeLines(trx, firmId, id, lines);
}

/**
 * Issues a draft: the next number of the firm's invoice sequence (taken in this transaction, so no gap),
 * the time of supply (the job's completion, else now), the due date by the firm's terms, and the firm's
 * and customer's details as they are now. Writes the customer's e-mail (PDF and pay link); returns its id.
 */
export async function issueDraft(
  trx: Knex.Transaction,
  deps: AppDeps,
  firmId: number,
  id: number,
): Promise<number | null> {
  const row = await findInvoice(trx, firmId, id, { forUpdate: true });
  if (!row) throw notFound('That invoice');
  if (row.status !== 'draft') throw conflict('This invoice is already issued.');
  if (Number(row.total_pence) <= 0 && Number(row.net_pence) <= 0)
    throw conflict('This invoice has nothing to charge: add a line with a price first.');
  const settings = await findMoneySettings(trx, firmId);
  const firm = (await findFirmForMoney(trx, firmId))!;
  const parties = row.job_id ? await findJobParties(trx, firmId, row.job_id) : undefined;
  const job = row.job_id ? await findJobRow(trx, firmId, row.job_id) : undefined;
  const now = deps.clock.now();
  const issuedOn = calendarDateIn(now, firm.time_zone);
  await markInvoiceIssued(trx, firmId, id, {
    number: await takeNextNumber(trx, firmId, 'invoice'),
    supplied_at: job?.completed_at ?? now,
    issued_at: now,
    issued_on: issuedOn,
    due_on: addDays(issuedOn, settings.paymentTermsDays),
    firm_name: firm.name,
    firm_address: firm.address,
    vat_number: settings.vatRegistered ? settings.vatNumber : null,
    vat_registered: settings.vatRegistered,
    customer_name: parties?.customerName ?? row.customer_name,
    customer_address: parties ? addressOf(parties) : row.customer_address,
    customer_email: parties?.customerEmail ?? row.customer_email,
  });
  return queueInvoiceEmail(trx, deps, firmId, id);
}

/**
 * At a job's completion, in its transaction (modules/jobs/job-completion-service.ts calls this): when the
 * firm has saved its money settings with "invoice on completion", the job has no invoice yet and its
 * lines charge something, the invoice is made and issued. Returns the e-mail to queue after commit.
 */
export async function issueInvoiceAtCompletion(
  trx: Knex.Transaction,
  deps: AppDeps,
  firmId: number,
  userId: number,
  jobId: number,
): Promise<number | null> {
  const settings = await findMoneySettings(trx, firmId);
  if (!settings.saved || !settings.invoiceOnCompletion) return null;
  if (await findInvoiceForJob(trx, firmId, jobId)) return null;
  const { lines } = await linesForJobInvoice(trx, deps, firmId, jobId);
  if (!lines.some((l) => l.unitPence > 0)) return null;
  const id = await createDraftForJob(trx, deps, firmId, userId, jobId, lines);
  return issueDraft(trx, deps, firmId, id);
}
