import { ForbiddenError } from '@casl/ability';
import type { InvoicePaymentsResponse } from '@heatfleet/domain';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { notFound } from '../../lib/http-error.ts';
import { findInvoice } from '../money/invoice-dal.ts';
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
  return {
    invoiceId,
    payments: await paymentsOfInvoice(deps.db, actor.firmId, invoiceId),
    cardPaymentsReady: Boolean(account?.charges_enabled),
  };
}
