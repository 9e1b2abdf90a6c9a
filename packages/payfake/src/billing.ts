import { paymentMethodFor, tryCard } from './cards.ts';
import { ApiError, invalidParam, missingParam } from './errors.ts';
import { newId, nowSeconds } from './ids.ts';
import { cardFields, errorBox, esc, formatMoney, messagePage, page } from './pages.ts';
import {
  listOf,
  metadataOf,
  optionalArray,
  optionalInteger,
  optionalObject,
  optionalString,
  requiredString,
  type ApiContext,
  type ApiRoute,
  type PageRoute,
} from './routing.ts';
import { PLATFORM, type ApiObject, type FakeState } from './state.ts';
import type { FormObject } from './form-body.ts';

interface Price extends ApiObject {
  unit_amount: number;
  currency: string;
  lookup_key: string | null;
}
interface SubscriptionItem extends ApiObject {
  price: Price;
  quantity: number;
  current_period_start: number;
  current_period_end: number;
}
export interface Subscription extends ApiObject {
  customer: string;
  status: 'trialing' | 'active' | 'past_due' | 'canceled' | 'incomplete';
  items: { object: 'list'; data: SubscriptionItem[] };
  trial_end: number | null;
  latest_invoice: string | null;
}
export interface Invoice extends ApiObject {
  customer: string;
  status: 'open' | 'paid';
  amount_due: number;
  amount_paid: number;
  amount_remaining: number;
  attempt_count: number;
  parent: { type: 'subscription_details'; subscription_details: { subscription: string } };
}

const MONTH_SECONDS = 30 * 24 * 3600;
/** Proration amounts waiting for the next invoice, per subscription. */
const pendingProrations = new Map<string, { description: string; amount: number }[]>();

function customerRoutes(): ApiRoute[] {
  return [
    {
      method: 'POST',
      pattern: /^\/v1\/customers$/,
      handle: ({ body, state, account }) =>
        state.put(account, {
          id: newId('cus', 14),
          object: 'customer',
          name: optionalString(body, 'name') ?? null,
          email: optionalString(body, 'email') ?? null,
          invoice_settings: { default_payment_method: null },
          metadata: metadataOf(body),
          created: nowSeconds(),
          livemode: false,
        }),
    },
    {
      method: 'GET',
      pattern: /^\/v1\/customers\/([^/]+)$/,
      handle: ({ params, state, account }) => state.get(account, params[0]!, 'customer', 'customer'),
    },
    {
      method: 'POST',
      pattern: /^\/v1\/customers\/([^/]+)$/,
      handle: ({ params, body, state, account }) => {
        const customer = state.get(account, params[0]!, 'customer', 'customer');
        const settings = optionalObject(body, 'invoice_settings');
        const methodId = settings ? optionalString(settings, 'default_payment_method') : undefined;
        if (methodId !== undefined) {
          const method = state.get(account, methodId, 'payment_method', 'invoice_settings[default_payment_method]');
          if (method.customer !== customer.id) {
            throw invalidParam(
              'invoice_settings[default_payment_method]',
              `The customer does not have a payment method with the ID ${methodId}. The payment method must be attached to the customer.`,
            );
          }
          customer.invoice_settings = { default_payment_method: methodId };
        }
        for (const key of ['name', 'email'] as const) {
          const value = optionalString(body, key);
          if (value !== undefined) customer[key] = value;
        }
        if (body.metadata !== undefined) customer.metadata = { ...(customer.metadata as object), ...metadataOf(body) };
        state.emit(account, 'customer.updated', customer);
        return customer;
      },
    },
    {
      method: 'GET',
      pattern: /^\/v1\/payment_methods\/([^/]+)$/,
      handle: ({ params, state, account }) => state.get(account, params[0]!, 'payment_method', 'payment_method'),
    },
    {
      method: 'GET',
      pattern: /^\/v1\/setup_intents\/([^/]+)$/,
      handle: ({ params, state, account }) => state.get(account, params[0]!, 'setup_intent', 'intent'),
    },
  ];
}

function priceRoutes(): ApiRoute[] {
  return [
    {
      method: 'GET',
      pattern: /^\/v1\/prices$/,
      handle: ({ query, state, account }) => {
        const keys = (optionalArray(query, 'lookup_keys') ?? []).map(String);
        const prices = state.list<Price>(
          account,
          'price',
          (p) => keys.length === 0 || keys.includes(p.lookup_key ?? ''),
        );
        return listOf('/v1/prices', prices, optionalInteger(query, 'limit') ?? 10);
      },
    },
    {
      method: 'POST',
      pattern: /^\/v1\/prices$/,
      handle: ({ body, state, account }) => {
        const unit = optionalInteger(body, 'unit_amount');
        if (unit === undefined) throw missingParam('unit_amount');
        const product = optionalObject(body, 'product_data');
        const recurring = optionalObject(body, 'recurring');
        const lookupKey = optionalString(body, 'lookup_key') ?? null;
        if (lookupKey !== null && state.list<Price>(account, 'price', (p) => p.lookup_key === lookupKey).length > 0) {
          throw invalidParam('lookup_key', `A price (\`${lookupKey}\`) already uses that lookup key.`);
        }
        const productObject = state.put(account, {
          id: newId('prod', 14),
          object: 'product',
          name: product ? requiredString(product, 'name', 'product_data[name]') : 'Product',
          active: true,
          created: nowSeconds(),
        });
        return state.put<Price>(account, {
          id: newId('price'),
          object: 'price',
          active: true,
          currency: requiredString(body, 'currency'),
          unit_amount: unit,
          lookup_key: lookupKey,
          product: productObject.id,
          recurring: recurring
            ? { interval: requiredString(recurring, 'interval', 'recurring[interval]'), interval_count: 1 }
            : null,
          type: recurring ? 'recurring' : 'one_time',
          metadata: metadataOf(body),
          created: nowSeconds(),
        });
      },
    },
  ];
}

function parseItems(body: FormObject): FormObject[] {
  const items = optionalArray(body, 'items') ?? [];
  return items.map((item, index) => {
    if (typeof item !== 'object' || Array.isArray(item)) throw invalidParam(`items[${index}]`, 'Invalid hash');
    return item;
  });
}

function createSubscription({ body, state, account }: ApiContext): Subscription {
  const customer = state.get(account, requiredString(body, 'customer'), 'customer', 'customer');
  const [item] = parseItems(body);
  if (!item) throw missingParam('items');
  const price = state.get<Price>(account, requiredString(item, 'price', 'items[0][price]'), 'price', 'items[0][price]');
  const quantity = optionalInteger(item, 'quantity', 'items[0][quantity]') ?? 1;
  if (quantity < 0) throw invalidParam('items[0][quantity]', 'This value must be greater than or equal to 0.');
  const trialDays = optionalInteger(body, 'trial_period_days') ?? 0;
  const now = nowSeconds();
  const periodEnd = trialDays > 0 ? now + trialDays * 24 * 3600 : now + MONTH_SECONDS;
  const subscription = state.put<Subscription>(account, {
    id: newId('sub'),
    object: 'subscription',
    customer: customer.id,
    status: trialDays > 0 ? 'trialing' : 'active',
    items: {
      object: 'list',
      data: [
        {
          id: newId('si', 14),
          object: 'subscription_item',
          price,
          quantity,
          current_period_start: now,
          current_period_end: periodEnd,
        },
      ],
    },
    trial_start: trialDays > 0 ? now : null,
    trial_end: trialDays > 0 ? periodEnd : null,
    cancel_at_period_end: false,
    latest_invoice: null,
    currency: price.currency,
    metadata: metadataOf(body),
    created: now,
    livemode: false,
  });
  state.emit(account, 'customer.subscription.created', subscription);
  if (trialDays === 0) billPeriod(state, account, subscription, false);
  return subscription;
}

function updateSubscription({ params, body, state, account }: ApiContext): Subscription {
  const subscription = state.get<Subscription>(account, params[0]!, 'subscription', 'subscription');
  const item = subscription.items.data[0]!;
  const previousQuantity = item.quantity;
  for (const [index, change] of parseItems(body).entries()) {
    const id = optionalString(change, 'id');
    if (id !== undefined && id !== item.id)
      throw invalidParam(`items[${index}][id]`, `No such subscription item: '${id}'`);
    const quantity = optionalInteger(change, 'quantity', `items[${index}][quantity]`);
    if (quantity !== undefined) {
      if (quantity < 0)
        throw invalidParam(`items[${index}][quantity]`, 'This value must be greater than or equal to 0.');
      item.quantity = quantity;
    }
  }
  const behaviour = optionalString(body, 'proration_behavior') ?? 'create_prorations';
  if (!['create_prorations', 'none', 'always_invoice'].includes(behaviour)) {
    throw invalidParam('proration_behavior', `Invalid proration_behavior: ${behaviour}`);
  }
  const delta = item.quantity - previousQuantity;
  // A trial costs nothing, so changing it prorates nothing; otherwise the rest of the period is charged or credited.
  if (delta !== 0 && behaviour !== 'none' && subscription.status !== 'trialing') {
    const now = nowSeconds();
    const share = Math.max(0, item.current_period_end - now) / (item.current_period_end - item.current_period_start);
    const amount = Math.round(delta * item.price.unit_amount * share);
    const list = pendingProrations.get(subscription.id) ?? [];
    list.push({
      description: `${delta > 0 ? 'Added' : 'Removed'} ${Math.abs(delta)} for the rest of the period`,
      amount,
    });
    pendingProrations.set(subscription.id, list);
  }
  if (body.metadata !== undefined)
    subscription.metadata = { ...(subscription.metadata as object), ...metadataOf(body) };
  state.emit(account, 'customer.subscription.updated', subscription, {
    items: { data: [{ ...item, quantity: previousQuantity }] },
  });
  return subscription;
}

function charge(
  state: FakeState,
  account: string,
  invoice: Invoice,
  cardNumber?: string,
  expiry = '12 / 34',
): string | null {
  const customer = state.get(account, invoice.customer, 'customer');
  let methodId = (customer.invoice_settings as { default_payment_method: string | null }).default_payment_method;
  let outcome: ReturnType<typeof tryCard>;
  if (cardNumber !== undefined) {
    outcome = tryCard(cardNumber);
    if (outcome.ok) {
      const method = state.put(account, paymentMethodFor(outcome, expiry, customer.id));
      methodId = method.id;
    }
  } else if (methodId === null) {
    outcome = {
      ok: false,
      code: 'invoice_payment_intent_requires_action',
      message: 'There is no card on file to pay this invoice.',
    };
  } else {
    const card = state.get(account, methodId, 'payment_method').card as { last4: string };
    // The saved card behaves as its number did: the declining test card keeps declining.
    outcome = card.last4 === '0002' ? tryCard('4000000000000002') : { ok: true, brand: 'visa', last4: card.last4 };
  }
  invoice.attempt_count += 1;
  const subscription = state.get<Subscription>(
    account,
    invoice.parent.subscription_details.subscription,
    'subscription',
  );
  const previousStatus = subscription.status;
  if (!outcome.ok) {
    invoice.next_payment_attempt = nowSeconds() + 3 * 24 * 3600;
    if (subscription.status !== 'incomplete') subscription.status = 'past_due';
    state.emit(account, 'invoice.payment_failed', invoice);
    if (previousStatus !== subscription.status) {
      state.emit(account, 'customer.subscription.updated', subscription, { status: previousStatus });
    }
    return outcome.message;
  }
  Object.assign(invoice, {
    status: 'paid',
    amount_paid: invoice.amount_due,
    amount_remaining: 0,
    next_payment_attempt: null,
    status_transitions: { paid_at: nowSeconds() },
    default_payment_method: methodId,
  });
  subscription.status = 'active';
  state.emit(account, 'invoice.paid', invoice);
  state.emit(account, 'invoice.payment_succeeded', invoice);
  if (previousStatus !== subscription.status) {
    state.emit(account, 'customer.subscription.updated', subscription, { status: previousStatus });
  }
  return null;
}

/** Ends the trial or the period now: a new period, its invoice, and a charge to the customer's saved card. */
export function billPeriod(state: FakeState, account: string, subscription: Subscription, advance = true): Invoice {
  const item = subscription.items.data[0]!;
  const now = nowSeconds();
  if (advance) {
    Object.assign(item, { current_period_start: now, current_period_end: now + MONTH_SECONDS });
    if (subscription.status === 'trialing') subscription.trial_end = now;
  }
  const lines = [
    {
      description: `${item.quantity} × van (per month)`,
      quantity: item.quantity,
      amount: item.quantity * item.price.unit_amount,
    },
    ...(pendingProrations.get(subscription.id) ?? []).map((p) => ({ ...p, quantity: 1 })),
  ];
  pendingProrations.delete(subscription.id);
  const total = Math.max(
    0,
    lines.reduce((sum, line) => sum + line.amount, 0),
  );
  const id = newId('in');
  const invoice = state.put<Invoice>(account, {
    id,
    object: 'invoice',
    customer: subscription.customer,
    status: 'open',
    currency: subscription.currency,
    amount_due: total,
    amount_paid: 0,
    amount_remaining: total,
    attempt_count: 0,
    next_payment_attempt: null,
    number: `HFP-${String(state.list(account, 'invoice').length + 1).padStart(4, '0')}`,
    period_start: item.current_period_start,
    period_end: item.current_period_end,
    hosted_invoice_url: `${state.publicUrl}/i/${id}`,
    invoice_pdf: null,
    parent: { type: 'subscription_details', subscription_details: { subscription: subscription.id } },
    lines: { object: 'list', data: lines.map((line) => ({ id: newId('il', 14), object: 'line_item', ...line })) },
    created: now,
    livemode: false,
  });
  subscription.latest_invoice = invoice.id;
  state.emit(account, 'invoice.created', invoice);
  state.emit(account, 'invoice.finalized', invoice);
  if (total === 0) charge(state, account, invoice, '4242424242424242');
  else charge(state, account, invoice);
  return invoice;
}

export const billingRoutes: ApiRoute[] = [
  ...customerRoutes(),
  ...priceRoutes(),
  { method: 'POST', pattern: /^\/v1\/subscriptions$/, handle: createSubscription },
  {
    method: 'GET',
    pattern: /^\/v1\/subscriptions\/([^/]+)$/,
    handle: ({ params, state, account }) => state.get(account, params[0]!, 'subscription', 'subscription'),
  },
  { method: 'POST', pattern: /^\/v1\/subscriptions\/([^/]+)$/, handle: updateSubscription },
  {
    method: 'GET',
    pattern: /^\/v1\/invoices$/,
    handle: ({ query, state, account }) => {
      const customer = optionalString(query, 'customer');
      const subscription = optionalString(query, 'subscription');
      const status = optionalString(query, 'status');
      const invoices = state.list<Invoice>(
        account,
        'invoice',
        (i) =>
          (customer === undefined || i.customer === customer) &&
          (status === undefined || i.status === status) &&
          (subscription === undefined || i.parent.subscription_details.subscription === subscription),
      );
      return listOf('/v1/invoices', invoices, optionalInteger(query, 'limit') ?? 10);
    },
  },
  {
    method: 'GET',
    pattern: /^\/v1\/invoices\/([^/]+)$/,
    handle: ({ params, state, account }) => state.get(account, params[0]!, 'invoice', 'invoice'),
  },
  {
    method: 'POST',
    pattern: /^\/v1\/invoices\/([^/]+)\/pay$/,
    handle: ({ params, state, account }) => {
      const invoice = state.get<Invoice>(account, params[0]!, 'invoice', 'invoice');
      if (invoice.status === 'paid')
        throw new ApiError(400, 'invalid_request_error', 'Invoice is already paid', 'invoice_already_paid');
      const error = charge(state, account, invoice);
      if (error !== null) {
        throw new ApiError(402, 'card_error', error, 'card_declined', undefined, { decline_code: 'generic_decline' });
      }
      return invoice;
    },
  },
];

/** Not part of the hosted service's API: lets a test or a developer end a trial or a month now. */
export const billingControlRoutes: ApiRoute[] = [
  {
    method: 'POST',
    pattern: /^\/_payfake\/subscriptions\/([^/]+)\/advance$/,
    handle: ({ params, state }) =>
      billPeriod(state, PLATFORM, state.get<Subscription>(PLATFORM, params[0]!, 'subscription')),
  },
];

export const billingPages: PageRoute[] = [
  {
    pattern: /^\/i\/([^/]+)$/,
    handle: ({ method, params, form, state }) => {
      const found = state.locate<Invoice>(params[0]!, 'invoice');
      if (!found) return { status: 404, html: messagePage('Not found', 'This invoice does not exist.') };
      const { account, object: invoice } = found;
      let error: string | null = null;
      if (method === 'POST' && invoice.status === 'open') {
        error = charge(
          state,
          account,
          invoice,
          optionalString(form, 'card_number') ?? '',
          optionalString(form, 'expiry'),
        );
      }
      const amount = formatMoney(invoice.amount_due, String(invoice.currency));
      if (invoice.status === 'paid') {
        return {
          html: page(
            'Invoice paid',
            `<h1>Invoice ${esc(String(invoice.number))}</h1><p class="total">${amount}</p><p role="status">Paid. Thank you.</p>`,
          ),
        };
      }
      return {
        status: error === null ? 200 : 402,
        html: page(
          'Pay invoice',
          `<h1>Invoice ${esc(String(invoice.number))}</h1><p class="total">${amount}</p>${errorBox(error)}
<form method="post">${cardFields()}<button type="submit">Pay ${amount}</button></form>`,
        ),
      };
    },
  },
];
