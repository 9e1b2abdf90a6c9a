import { ForbiddenError } from '@casl/ability';
import { amountDue, type InvoicePaymentsResponse } from '@heatfleet/domain';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { notFound } from '../../lib/http-error.ts';
import { findInvoice } from '../money/invoice-dal.ts';
import { invoiceMoneyOf } from '../money/invoice-payments.ts';
import { findPaymentAccount } from './payment-dal.ts';
import { paymentsOfInvoice } from './payment-read.ts';

export async function getInvoicePayments(
  deps: AppDeps,
  actor: Actor,
  invoiceId: number,
): Promise<InvoicePaymentsResponse> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Payment');
  const invoice = await findInvoice(deps.db, actor.firmId, invoiceId);
  if (!invoice) throw notFound('That invoice');
  const account = await findPaymentAccount(deps.db, actor.firmId);
  const money = invoiceMoneyOf(invoice);
  return {
    invoiceId,
    invoice: {
      number: invoice.number === null ? null : String(invoice.number),
      customerName: invoice.customer_name,
      status: invoice.status,
      totalPence: money.totalPence,
      paidPence: money.paidPence,
      duePence: amountDue(money),
    },
    payments: await paymentsOfInvoice(deps.db, actor.firmId, invoiceId),
    cardPaymentsReady: Boolean(account?.charges_enabled),
  };
}
