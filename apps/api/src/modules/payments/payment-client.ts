import Stripe from 'stripe';
import type { Logger } from 'pino';
import type { Env } from '../../config/env.ts';
import { HttpError } from '../../lib/http-error.ts';

const clients = new WeakMap<Env, Stripe>();

/**
 * The payment service's official SDK. Only configuration says where it points: the hosted service in
 * production, the local stand-in (packages/payfake) by STRIPE_HOST/PORT/PROTOCOL otherwise.
 */
export function paymentClient(env: Env): Stripe {
  let client = clients.get(env);
  if (!client) {
    client = new Stripe(env.STRIPE_SECRET_KEY, {
      ...(env.STRIPE_HOST === undefined ? {} : { host: env.STRIPE_HOST }),
      ...(env.STRIPE_PORT === undefined ? {} : { port: env.STRIPE_PORT }),
      ...(env.STRIPE_PROTOCOL === undefined ? {} : { protocol: env.STRIPE_PROTOCOL }),
      // One retry of a dropped connection (the SDK reuses its Idempotency-Key), then a clear 503 to the person.
      maxNetworkRetries: 1,
      timeout: 15_000,
      appInfo: { name: 'Heatfleet' },
    });
    clients.set(env, client);
  }
  return client;
}

export const paymentServiceDown = () =>
  new HttpError(
    503,
    'The card payment service cannot be reached just now. Nothing has been charged or changed; please try again in a few minutes.',
  );

/**
 * Calls the payment service and turns its failures into answers in the person's words: unreachable, slow or
 * failing on its side is a 503 (nothing was written here); a declined card is a 400 with the service's message.
 */
export async function callPaymentService<T>(logger: Logger, what: string, call: () => Promise<T>): Promise<T> {
  try {
    return await call();
  } catch (error) {
    const e = error as { type?: string; statusCode?: number; code?: string; message?: string };
    if (e.type === 'StripeCardError') {
      throw new HttpError(
        400,
        e.message?.replace(/^\[req_[^\]]*\]\s*/, '') ?? 'The card was declined.',
        'CardDeclined',
      );
    }
    if (e.type === 'StripeInvalidRequestError' && e.code === 'amount_too_small') {
      throw new HttpError(400, 'A card payment must be at least £0.30.', 'RuleBroken');
    }
    logger.warn({ err: error, what }, 'payment service call failed');
    throw paymentServiceDown();
  }
}
