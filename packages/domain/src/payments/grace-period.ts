import { SUBSCRIPTION_GRACE_DAYS } from './payment-schemas.ts';

const DAY_MS = 24 * 60 * 60 * 1000;

/**
 * A firm whose subscription payment failed keeps working for the grace period, then turns read-only until an
 * invoice is paid (README, Payments: 14 days, counted from the first failed payment of the unpaid run).
 */
export function readOnlyFrom(paymentFailedAt: Date | null): Date | null {
  return paymentFailedAt === null ? null : new Date(paymentFailedAt.getTime() + SUBSCRIPTION_GRACE_DAYS * DAY_MS);
}

export function isFirmReadOnly(paymentFailedAt: Date | null, now: Date): boolean {
  const from = readOnlyFrom(paymentFailedAt);
  return from !== null && now.getTime() >= from.getTime();
}

/** The monthly charge: whole pence per active van, no floating point. */
export function monthlyChargePence(activeVans: number, unitPence: number): number {
  return activeVans * unitPence;
}
