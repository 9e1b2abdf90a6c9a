import { randomUUID } from 'node:crypto';
import { ForbiddenError } from '@casl/ability';
import QRCode from 'qrcode';
import { amountDue, type PayLinkResponse, type PublicPayLink } from '@heatfleet/domain';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { conflict, HttpError, notFound } from '../../lib/http-error.ts';
import { findInvoice, type InvoiceRow } from '../money/invoice-dal.ts';
import { invoiceForPayToken, invoiceMoneyOf, invoicePayLink, PAY_LINK_DAYS } from '../money/invoice-payments.ts';
import { callPaymentService, paymentClient } from './payment-client.ts';
import { findPaymentAccount, insertPayment } from './payment-dal.ts';

const linkGone = () => new HttpError(404, 'This pay link is not valid or has expired. Ask the firm for a new one.');

function invoiceNumberOf(row: InvoiceRow): string {
  return row.number === null ? 'draft' : String(row.number);
}

async function openPayLink(deps: AppDeps, token: string) {
  const found = await invoiceForPayToken(deps.db, token, deps.clock.now());
  if (!found) throw linkGone();
  const invoice = await findInvoice(deps.db, found.firmId, found.invoiceId);
  if (!invoice) throw linkGone();
  return { firmId: found.firmId, invoice };
}

/** What the customer sees on /pay/<token> before going to the hosted checkout (no sign-in; the token is the key). */
export async function readPayLink(deps: AppDeps, token: string): Promise<PublicPayLink> {
  const { invoice } = await openPayLink(deps, token);
  const money = invoiceMoneyOf(invoice);
  const due = amountDue(money);
  return {
    firmName: invoice.firm_name,
    invoiceNumber: invoiceNumberOf(invoice),
    totalPence: money.totalPence,
    duePence: due,
    state: due > 0 ? 'payable' : invoice.status === 'paid' ? 'paid' : 'not_payable',
  };
}

/**
 * A hosted checkout for what is still owed, on the firm's own connected account. The session is made first
 * (our reference is its Idempotency-Key and metadata); the payment row after. If the service is down nothing is
 * written and the link works again when it returns; if our write fails, the webhook finds the payment by its
 * reference and writes it then.
 */
export async function startCheckout(
  deps: AppDeps,
  token: string,
  startedFrom: 'email_link' | 'doorstep',
): Promise<{ url: string }> {
  const { firmId, invoice } = await openPayLink(deps, token);
  const due = amountDue(invoiceMoneyOf(invoice));
  if (due === 0) throw conflict('Nothing is owed on this invoice: it has been paid.');
  const account = await findPaymentAccount(deps.db, firmId);
  if (!account?.charges_enabled) {
    throw conflict('This firm cannot take card payments yet. Please pay them another way or try again later.');
  }
  const reference = randomUUID();
  const metadata = { firmId: String(firmId), invoiceId: String(invoice.id), paymentReference: reference };
  const back = new URL(`/pay/${token}`, deps.env.APP_ORIGIN).toString();
  const session = await callPaymentService(deps.logger, 'checkout.sessions.create', () =>
    paymentClient(deps.env).checkout.sessions.create(
      {
        mode: 'payment',
        line_items: [
          {
            quantity: 1,
            price_data: {
              currency: 'gbp',
              unit_amount: due,
              product_data: { name: `Invoice ${invoiceNumberOf(invoice)} from ${invoice.firm_name}` },
            },
          },
        ],
        customer_email: invoice.customer_email ?? undefined,
        client_reference_id: reference,
        metadata,
        payment_intent_data: { metadata },
        success_url: `${back}?paid=1`,
        cancel_url: back,
      },
      { stripeAccount: account.provider_account_id, idempotencyKey: reference },
    ),
  );
  if (!session.url) throw new HttpError(503, 'The payment page could not be opened. Please try again.');
  await insertPayment(deps.db, {
    firm_id: firmId,
    invoice_id: invoice.id,
    reference,
    checkout_session_id: session.id,
    amount_pence: due,
    started_from: startedFrom,
    status: 'pending',
  });
  return { url: session.url };
}

/** A fresh pay link for the engineer to show as a QR code on the doorstep (the customer's phone opens it). */
export async function doorstepPayLink(deps: AppDeps, actor: Actor, invoiceId: number): Promise<PayLinkResponse> {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Payment');
  const invoice = await findInvoice(deps.db, actor.firmId, invoiceId);
  if (!invoice) throw notFound('That invoice');
  if (invoice.status === 'draft') throw conflict('Issue the invoice before taking payment for it.');
  const due = amountDue(invoiceMoneyOf(invoice));
  if (due === 0) throw conflict('Nothing is owed on this invoice.');
  const account = await findPaymentAccount(deps.db, actor.firmId);
  if (!account?.charges_enabled) {
    throw conflict('The firm cannot take card payments yet: an owner connects its payment account in Settings.');
  }
  const now = deps.clock.now();
  const link = await deps.db.transaction((trx) =>
    invoicePayLink(trx, deps.env.APP_ORIGIN, actor.firmId, invoiceId, now),
  );
  const url = `${link}?from=doorstep`;
  const qrSvg = await QRCode.toString(url, { type: 'svg', errorCorrectionLevel: 'M', margin: 2 });
  return { url, qrSvg, duePence: due, expiresAt: new Date(now.getTime() + PAY_LINK_DAYS * 86_400_000).toISOString() };
}
