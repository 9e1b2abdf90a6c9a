import { tryCard, paymentMethodFor } from './cards.ts';
import { assertChargesEnabled } from './connect.ts';
import { ApiError, invalidParam, missingParam } from './errors.ts';
import { newId, nowSeconds } from './ids.ts';
import { cardFields, errorBox, esc, formatMoney, messagePage, page } from './pages.ts';
import {
  metadataOf,
  optionalArray,
  optionalInteger,
  optionalObject,
  optionalString,
  requiredString,
  type ApiRoute,
  type PageContext,
  type PageRoute,
} from './routing.ts';
import { PLATFORM, type ApiObject, type FakeState } from './state.ts';
import type { FormObject } from './form-body.ts';

interface LineItem {
  description: string;
  unit_amount: number;
  quantity: number;
  amount_total: number;
}

export interface CheckoutSession extends ApiObject {
  mode: 'payment' | 'setup';
  status: 'open' | 'complete' | 'expired';
  payment_status: 'unpaid' | 'paid' | 'no_payment_required';
  amount_total: number | null;
  currency: string | null;
  customer: string | null;
  payment_intent: string | null;
  setup_intent: string | null;
  success_url: string;
  cancel_url: string | null;
  metadata: Record<string, string>;
  expires_at: number;
}

const lineItems = new WeakMap<CheckoutSession, LineItem[]>();
const intentMetadata = new WeakMap<CheckoutSession, Record<string, string>>();
// GBP's smallest charge on the hosted service (its published minimum charge amounts): 30p.
const MINIMUM_PENCE = 30;

function parseLineItems(body: FormObject): LineItem[] {
  const items = optionalArray(body, 'line_items');
  if (items === undefined || items.length === 0) throw missingParam('line_items');
  return items.map((raw, index) => {
    if (typeof raw !== 'object' || Array.isArray(raw)) throw invalidParam(`line_items[${index}]`, 'Invalid hash');
    const priceData = optionalObject(raw, 'price_data');
    if (!priceData) throw missingParam(`line_items[${index}][price_data]`);
    const unit = optionalInteger(priceData, 'unit_amount', `line_items[${index}][price_data][unit_amount]`);
    if (unit === undefined || unit < 0) throw missingParam(`line_items[${index}][price_data][unit_amount]`);
    const product = optionalObject(priceData, 'product_data') ?? {};
    const quantity = optionalInteger(raw, 'quantity', `line_items[${index}][quantity]`) ?? 1;
    if (quantity < 1)
      throw invalidParam(`line_items[${index}][quantity]`, 'This value must be greater than or equal to 1.');
    return {
      description: requiredString(product, 'name', `line_items[${index}][price_data][product_data][name]`),
      unit_amount: unit,
      quantity,
      amount_total: unit * quantity,
    };
  });
}

function createSession(ctx: Parameters<ApiRoute['handle']>[0]): CheckoutSession {
  const { body, state, config, account } = ctx;
  if (account !== PLATFORM) assertChargesEnabled(state.find(PLATFORM, account, 'account'));
  const mode = requiredString(body, 'mode');
  if (mode !== 'payment' && mode !== 'setup') {
    throw invalidParam('mode', 'Invalid mode: the local stand-in serves payment and setup');
  }
  const created = nowSeconds();
  const items = mode === 'payment' ? parseLineItems(body) : [];
  const amount = items.reduce((sum, item) => sum + item.amount_total, 0);
  const currency = (items.length > 0 ? 'gbp' : optionalString(body, 'currency')) ?? null;
  if (mode === 'payment' && amount < MINIMUM_PENCE) {
    throw new ApiError(
      400,
      'invalid_request_error',
      "The Checkout Session's total amount due must add up to at least £0.30 gbp",
      'amount_too_small',
    );
  }
  const customer = optionalString(body, 'customer') ?? null;
  if (customer !== null) state.get(account, customer, 'customer', 'customer');
  const id = newId('cs_test', 58);
  const session = state.put<CheckoutSession>(account, {
    id,
    object: 'checkout.session',
    mode,
    status: 'open',
    payment_status: mode === 'setup' ? 'no_payment_required' : 'unpaid',
    amount_subtotal: mode === 'payment' ? amount : null,
    amount_total: mode === 'payment' ? amount : null,
    currency,
    client_reference_id: optionalString(body, 'client_reference_id') ?? null,
    customer,
    customer_email: optionalString(body, 'customer_email') ?? null,
    payment_intent: null,
    setup_intent: null,
    success_url: requiredString(body, 'success_url'),
    cancel_url: optionalString(body, 'cancel_url') ?? null,
    metadata: metadataOf(body),
    created,
    expires_at: optionalInteger(body, 'expires_at') ?? created + 24 * 3600,
    livemode: false,
    url: `${config.publicUrl}/c/pay/${id}`,
  });
  lineItems.set(session, items);
  const intentData = optionalObject(body, 'payment_intent_data');
  intentMetadata.set(session, intentData ? metadataOf(intentData) : {});
  return session;
}

function expireIfDue(session: CheckoutSession): void {
  if (session.status === 'open' && session.expires_at <= nowSeconds())
    Object.assign(session, { status: 'expired', url: null });
}

export interface Charge extends ApiObject {
  amount: number;
  amount_refunded: number;
  refunded: boolean;
  payment_intent: string;
}

function refund(ctx: Parameters<ApiRoute['handle']>[0]): ApiObject {
  const { body, state, account } = ctx;
  const intentId = optionalString(body, 'payment_intent');
  const chargeId = optionalString(body, 'charge');
  let charge: Charge;
  if (chargeId !== undefined) charge = state.get<Charge>(account, chargeId, 'charge', 'charge');
  else if (intentId !== undefined) {
    const intent = state.get(account, intentId, 'payment_intent', 'payment_intent');
    if (typeof intent.latest_charge !== 'string') {
      throw new ApiError(
        400,
        'invalid_request_error',
        `This PaymentIntent (${intentId}) does not have a successful charge to refund.`,
        'charge_not_refundable',
      );
    }
    charge = state.get<Charge>(account, intent.latest_charge, 'charge');
  } else throw missingParam('payment_intent');
  const remaining = charge.amount - charge.amount_refunded;
  if (remaining === 0) {
    throw new ApiError(
      400,
      'invalid_request_error',
      `Charge ${charge.id} has already been refunded.`,
      'charge_already_refunded',
    );
  }
  const amount = optionalInteger(body, 'amount') ?? remaining;
  if (amount < 1) throw invalidParam('amount', 'This value must be greater than or equal to 1.');
  if (amount > remaining) {
    throw new ApiError(
      400,
      'invalid_request_error',
      `Refund amount (${formatMoney(amount, 'gbp')}) is greater than unrefunded amount on charge (${formatMoney(remaining, 'gbp')})`,
      undefined,
      'amount',
    );
  }
  const refundObject = state.put(account, {
    id: newId('re'),
    object: 'refund',
    amount,
    charge: charge.id,
    payment_intent: charge.payment_intent,
    currency: 'gbp',
    status: 'succeeded',
    reason: optionalString(body, 'reason') ?? null,
    metadata: metadataOf(body),
    created: nowSeconds(),
  });
  const previous = { amount_refunded: charge.amount_refunded, refunded: charge.refunded };
  charge.amount_refunded += amount;
  charge.refunded = charge.amount_refunded === charge.amount;
  state.emit(account, 'refund.created', refundObject);
  state.emit(account, 'charge.refunded', charge, previous);
  return refundObject;
}

export const checkoutRoutes: ApiRoute[] = [
  { method: 'POST', pattern: /^\/v1\/checkout\/sessions$/, handle: createSession },
  {
    method: 'GET',
    pattern: /^\/v1\/checkout\/sessions\/([^/]+)$/,
    handle: ({ params, state, account }) => {
      const session = state.get<CheckoutSession>(account, params[0]!, 'checkout.session', 'session');
      expireIfDue(session);
      return session;
    },
  },
  {
    method: 'POST',
    pattern: /^\/v1\/checkout\/sessions\/([^/]+)\/expire$/,
    handle: ({ params, state, account }) => {
      const session = state.get<CheckoutSession>(account, params[0]!, 'checkout.session', 'session');
      if (session.status !== 'open') {
        throw new ApiError(
          400,
          'invalid_request_error',
          `Only Checkout Sessions with a status in ["open"] can be expired. This Checkout Session has a status of "${session.status}".`,
        );
      }
      Object.assign(session, { status: 'expired', url: null });
      state.emit(account, 'checkout.session.expired', session);
      return session;
    },
  },
  {
    method: 'GET',
    pattern: /^\/v1\/payment_intents\/([^/]+)$/,
    handle: ({ params, state, account }) => state.get(account, params[0]!, 'payment_intent', 'intent'),
  },
  {
    method: 'GET',
    pattern: /^\/v1\/charges\/([^/]+)$/,
    handle: ({ params, state, account }) => state.get(account, params[0]!, 'charge', 'charge'),
  },
  { method: 'POST', pattern: /^\/v1\/refunds$/, handle: refund },
];

function sessionPage(session: CheckoutSession, error: string | null): string {
  const items = lineItems.get(session) ?? [];
  const rows = items
    .map(
      (item) =>
        `<tr><td>${esc(item.description)}${item.quantity > 1 ? ` × ${item.quantity}` : ''}</td><td class="amount">${formatMoney(item.amount_total, 'gbp')}</td></tr>`,
    )
    .join('');
  const heading =
    session.mode === 'payment'
      ? `<h1>Pay</h1><table>${rows}</table><p class="total" data-testid="total">${formatMoney(session.amount_total ?? 0, session.currency ?? 'gbp')}</p>`
      : '<h1>Save a card for future payments</h1>';
  return page(
    session.mode === 'payment' ? 'Pay' : 'Save a card',
    `${heading}${errorBox(error)}
<form method="post">${cardFields()}
<button type="submit">${session.mode === 'payment' ? `Pay ${formatMoney(session.amount_total ?? 0, 'gbp')}` : 'Save card'}</button>
</form>${session.cancel_url ? `<a class="button secondary" href="${esc(session.cancel_url)}">Cancel</a>` : ''}`,
  );
}

function successUrl(session: CheckoutSession): string {
  return session.success_url.replace('{CHECKOUT_SESSION_ID}', session.id);
}

function payForSession(state: FakeState, account: string, session: CheckoutSession, form: FormObject): string | null {
  const outcome = tryCard(optionalString(form, 'card_number') ?? '');
  const expiry = optionalString(form, 'expiry') ?? '12 / 34';
  if (session.mode === 'setup') {
    if (!outcome.ok) return outcome.message;
    const method = state.put(account, paymentMethodFor(outcome, expiry, session.customer));
    const intent = state.put(account, {
      id: newId('seti'),
      object: 'setup_intent',
      status: 'succeeded',
      customer: session.customer,
      payment_method: method.id,
      usage: 'off_session',
      created: nowSeconds(),
      metadata: {},
    });
    Object.assign(session, { status: 'complete', setup_intent: intent.id, url: null });
    state.emit(account, 'setup_intent.succeeded', intent);
    state.emit(account, 'checkout.session.completed', session);
    return null;
  }
  let intent =
    session.payment_intent === null ? undefined : state.find(account, session.payment_intent, 'payment_intent');
  if (intent === undefined) {
    intent = state.put(account, {
      id: newId('pi'),
      object: 'payment_intent',
      amount: session.amount_total,
      amount_received: 0,
      currency: session.currency,
      status: 'requires_payment_method',
      latest_charge: null,
      last_payment_error: null,
      metadata: intentMetadata.get(session) ?? {},
      created: nowSeconds(),
      livemode: false,
    });
    session.payment_intent = intent.id;
  }
  if (!outcome.ok) {
    intent.last_payment_error = {
      type: 'card_error',
      code: outcome.code,
      ...(outcome.declineCode ? { decline_code: outcome.declineCode } : {}),
      message: outcome.message,
    };
    state.emit(account, 'payment_intent.payment_failed', intent);
    return outcome.message;
  }
  const method = state.put(account, paymentMethodFor(outcome, expiry, null));
  const charge = state.put<Charge>(account, {
    id: newId('ch'),
    object: 'charge',
    amount: session.amount_total ?? 0,
    amount_captured: session.amount_total ?? 0,
    amount_refunded: 0,
    refunded: false,
    paid: true,
    status: 'succeeded',
    currency: session.currency,
    payment_intent: intent.id,
    payment_method: method.id,
    payment_method_details: { type: 'card', card: { brand: outcome.brand, last4: outcome.last4 } },
    metadata: intent.metadata,
    created: nowSeconds(),
  });
  Object.assign(intent, {
    status: 'succeeded',
    amount_received: charge.amount,
    latest_charge: charge.id,
    payment_method: method.id,
    last_payment_error: null,
  });
  Object.assign(session, { status: 'complete', payment_status: 'paid', url: null });
  state.emit(account, 'charge.succeeded', charge);
  state.emit(account, 'payment_intent.succeeded', intent);
  state.emit(account, 'checkout.session.completed', session);
  return null;
}

function checkoutPage({ method, params, form, state }: PageContext) {
  const found = state.locate<CheckoutSession>(params[0]!, 'checkout.session');
  if (!found) return { status: 404, html: messagePage('Not found', 'This checkout page does not exist.') };
  const { account, object: session } = found;
  expireIfDue(session);
  if (session.status === 'complete') return { redirect: successUrl(session) };
  if (session.status === 'expired') {
    return { status: 410, html: messagePage('This checkout has expired', 'Go back and start again.') };
  }
  if (method !== 'POST') return { html: sessionPage(session, null) };
  const error = payForSession(state, account, session, form);
  return error === null ? { redirect: successUrl(session) } : { status: 402, html: sessionPage(session, error) };
}

export const checkoutPages: PageRoute[] = [{ pattern: /^\/c\/pay\/([^/]+)$/, handle: checkoutPage }];
