import { newId, nowSeconds } from './ids.ts';
import type { ApiObject } from './state.ts';

/** What a test card does, after the hosted service's published test numbers. */
export type CardOutcome =
  { ok: true; brand: string; last4: string } | { ok: false; code: string; declineCode?: string; message: string };

export function tryCard(rawNumber: string): CardOutcome {
  const number = rawNumber.replace(/[\s-]/g, '');
  if (!/^\d{12,19}$/.test(number))
    return { ok: false, code: 'incorrect_number', message: 'Your card number is incorrect.' };
  const last4 = number.slice(-4);
  if (number === '4000000000000002') {
    return { ok: false, code: 'card_declined', declineCode: 'generic_decline', message: 'Your card was declined.' };
  }
  if (number === '4000000000009995') {
    return {
      ok: false,
      code: 'card_declined',
      declineCode: 'insufficient_funds',
      message: 'Your card has insufficient funds.',
    };
  }
  if (number === '4242424242424242') return { ok: true, brand: 'visa', last4 };
  if (number === '5555555555554444') return { ok: true, brand: 'mastercard', last4 };
  return { ok: false, code: 'card_declined', declineCode: 'generic_decline', message: 'Your card was declined.' };
}

export function paymentMethodFor(
  card: { brand: string; last4: string },
  expiry: string,
  customer: string | null,
): ApiObject {
  const [month, year] = expiry.split('/').map((part) => Number(part.trim()));
  return {
    id: newId('pm'),
    object: 'payment_method',
    type: 'card',
    created: nowSeconds(),
    customer,
    livemode: false,
    metadata: {},
    card: {
      brand: card.brand,
      last4: card.last4,
      exp_month: Number.isInteger(month) && month! >= 1 && month! <= 12 ? month : 12,
      exp_year: Number.isInteger(year) ? 2000 + (year! % 100) : 2034,
      country: 'GB',
      funding: 'credit',
    },
  };
}
