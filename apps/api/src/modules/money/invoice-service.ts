import { ForbiddenError } from '@casl/ability';
import type { Invoice, InvoiceState, InvoiceSummary, MoneyLineInput } from '@heatfleet/domain';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { withTransactionRetry } from '../../db/with-retry.ts';
import { notFound } from '../../lib/http-error.ts';
import { requireJob } from '../jobs/job-access.ts';
import { invoiceAnswer, invoiceSummary } from './invoice-answer.ts';
import { findInvoice, listInvoices } from './invoice-dal.ts';
import { createDraftForJob, issueDraft, replaceDraftLines } from './invoice-issue.ts';
import { invoicePdf } from './invoice-pdf.ts';
import { priceListLinesForJob } from './job-lines.ts';
import { findFirmForMoney } from './job-lines-dal.ts';

export async function listInvoicesFor(
  deps: AppDeps,
  actor: Actor,
  filter: { status?: InvoiceState; jobId?: number },
): Promise<InvoiceSummary[]> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Invoice');
  return (await listInvoices(deps.db, actor.firmId, filter)).map(invoiceSummary);
}

export async function getInvoice(deps: AppDeps, actor: Actor, id: number): Promise<Invoice> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Invoice');
  const row = await findInvoice(deps.db, actor.firmId, id);
  if (!row) throw notFound('That invoice');
  return invoiceAnswer(deps.db, actor.firmId, row);
}

/** The lines the price list gives a job now (a quote or a hand-made invoice starts from them). */
export async function suggestLinesForJob(deps: AppDeps, actor: Actor, jobId: number): Promise<MoneyLineInput[]> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'PriceList');
  const row = await requireJob(deps.db, actor.firmId, jobId);
  return priceListLinesForJob(deps.db, deps, actor.firmId, row);
}

export async function createInvoiceForJob(deps: AppDeps, actor: Actor, jobId: number): Promise<Invoice> {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Invoice');
  return deps.db.transaction(async (trx) => {
    await requireJob(trx, actor.firmId, jobId, { forUpdate: true });
    const id = await createDraftForJob(trx, deps, actor.firmId, actor.userId, jobId);
    return invoiceAnswer(trx, actor.firmId, (await findInvoice(trx, actor.firmId, id))!);
  });
}

/** A draft's lines replaced; an issued invoice answers 409 and is not touched. */
export async function putInvoiceLines(
  deps: AppDeps,
  actor: Actor,
  id: number,
  lines: MoneyLineInput[],
): Promise<Invoice> {
  ForbiddenError.from(actor.ability).throwUnlessCan('update', 'Invoice');
  return deps.db.transaction(async (trx) => {
    await replaceDraftLines(trx, actor.firmId, id, lines);
    return invoiceAnswer(trx, actor.firmId, (await findInvoice(trx, actor.firmId, id))!);
  });
}

export async function issueInvoice(deps: AppDeps, actor: Actor, id: number): Promise<Invoice> {
  ForbiddenError.from(actor.ability).throwUnlessCan('update', 'Invoice');
  let emailId: number | null = null;
  const answer = await withTransactionRetry(() =>
    deps.db.transaction(async (trx) => {
      emailId = await issueDraft(trx, deps, actor.firmId, id);
      return invoiceAnswer(trx, actor.firmId, (await findInvoice(trx, actor.firmId, id))!);
    }),
  );
  if (emailId !== null) await deps.mailQueue.notify([emailId]);
  return answer;
}

export async function invoicePdfFor(deps: AppDeps, actor: Actor, id: number): Promise<{ pdf: Buffer; name: string }> {
  const inv = await getInvoice(deps, actor, id);
  const firm = (await findFirmForMoney(deps.db, actor.firmId))!;
  return { pdf: await invoicePdf(inv, firm.time_zone), name: `invoice-${inv.number ?? `draft-${id}`}.pdf` };
}
