import { ForbiddenError } from '@casl/ability';
import { invoiceStateAfterPayments, priceLines, type CreditNoteInput, type Invoice } from '@heatfleet/domain';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { withTransactionRetry } from '../../db/with-retry.ts';
import { conflict, notFound, ruleBroken } from '../../lib/http-error.ts';
import { creditedQuantities, findCreditNote, insertCreditNote } from './credit-note-dal.ts';
import { invoiceAnswer } from './invoice-answer.ts';
import { findInvoice, setInvoiceMoney } from './invoice-dal.ts';
import { creditNotePdf } from './invoice-pdf.ts';
import { invoiceMoneyOf } from './invoice-payments.ts';
import { findFirmForMoney } from './job-lines-dal.ts';
import { insertLines, listLines } from './money-line-dal.ts';
import { takeNextNumber } from './money-settings-dal.ts';

/**
 * A credit note against an issued invoice: the lines (or part of their quantities) credited at the
 * invoice's own prices and rates, never more than is left uncredited; its own gap-free number; the
 * invoice's credited sum and state follow. The invoice itself is not touched otherwise.
 */
export async function createCreditNote(
  deps: AppDeps,
  actor: Actor,
  invoiceId: number,
  input: CreditNoteInput,
): Promise<Invoice> {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Invoice');
  return withTransactionRetry(() =>
    deps.db.transaction(async (trx) => {
      const inv = await findInvoice(trx, actor.firmId, invoiceId, { forUpdate: true });
      if (!inv) throw notFound('That invoice');
      if (inv.status === 'draft')
        throw conflict('A draft invoice is changed directly; credit notes are for issued ones.');
      const lines = (await listLines(trx, 'invoice_lines', actor.firmId, [invoiceId])).get(invoiceId) ?? [];
      const done = await creditedQuantities(trx, actor.firmId, invoiceId);
      const wanted =
        input.lines ?? lines.map((l) => ({ invoiceLineId: l.id, quantity: l.quantity - (done.get(l.id) ?? 0) }));
      const picked = wanted
        .filter((w) => w.quantity > 0)
        .map((w, i) => {
          const line = lines.find((l) => l.id === w.invoiceLineId);
          if (!line)
            throw ruleBroken('That line is not on this invoice.', [
              { path: `lines.${i}.invoiceLineId`, message: 'Not on this invoice.' },
            ]);
          const left = line.quantity - (done.get(line.id) ?? 0);
          if (w.quantity > left)
            throw ruleBroken(`Only ${left} of "${line.description}" is left to credit.`, [
              { path: `lines.${i}.quantity`, message: `At most ${left}.` },
            ]);
          return { line, quantity: w.quantity };
        });
      if (!picked.length) throw conflict('Everything on this invoice has already been credited.');
      const priced = priceLines(
        picked.map((p) => ({
          description: p.line.description,
          quantity: p.quantity,
          unitPence: p.line.unitPence,
          vatRateBp: p.line.vatRateBp,
        })),
        Boolean(inv.vat_registered),
      );
      const noteId = await insertCreditNote(trx, {
        firm_id: actor.firmId,
        invoice_id: invoiceId,
        number: await takeNextNumber(trx, actor.firmId, 'credit_note'),
        reason: input.reason,
        issued_at: deps.clock.now(),
        net_pence: priced.totals.netPence,
        vat_pence: priced.totals.vatPence,
        total_pence: priced.totals.totalPence,
        created_by_user_id: actor.userId,
      });
      await insertLines(
        trx,
        'credit_note_lines',
        actor.firmId,
        noteId,
        priced.lines.map((l, i) => ({
          ...l,
          kind: picked[i]!.line.kind,
          invoiceLineId: picked[i]!.line.id,
          productId: picked[i]!.line.productId,
          priceItemId: picked[i]!.line.priceItemId,
        })),
      );
      const money = invoiceMoneyOf(inv);
      money.creditedPence += priced.totals.totalPence;
      await setInvoiceMoney(trx, actor.firmId, invoiceId, {
        paid_pence: money.paidPence,
        credited_pence: money.creditedPence,
        status: invoiceStateAfterPayments(money),
      });
      return invoiceAnswer(trx, actor.firmId, (await findInvoice(trx, actor.firmId, invoiceId))!);
    }),
  );
}

export async function creditNotePdfFor(deps: AppDeps, actor: Actor, id: number): Promise<Buffer> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Invoice');
  const note = await findCreditNote(deps.db, actor.firmId, id);
  if (!note) throw notFound('That credit note');
  const inv = (await findInvoice(deps.db, actor.firmId, note.invoice_id))!;
  const answer = await invoiceAnswer(deps.db, actor.firmId, inv);
  const firm = (await findFirmForMoney(deps.db, actor.firmId))!;
  return creditNotePdf(
    answer.creditNotes.find((n) => n.id === id)!,
    answer,
    firm.time_zone,
  );
}
