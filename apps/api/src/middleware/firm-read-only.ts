import { firmReadOnlyMessage, isFirmReadOnly } from '@heatfleet/domain';
import type { Actor, AppDeps } from '../app-deps.ts';
import { HttpError } from '../lib/http-error.ts';
import { findPaymentFailedAt } from '../modules/billing/billing-dal.ts';
import type { RouteDefinition } from '../routes/route-registry.ts';

/**
 * Writes a read-only firm may still make: paying (or saving a card) lifts it, and a person's own account and
 * session are theirs, not the firm's. Every read (and so every export) stays open.
 */
const allowedWhileReadOnly = new Set([
  'post /billing/card',
  'post /billing/pay',
  'put /me/active-firm',
  'put /me/password',
  'post /me/firms',
]);

/**
 * A firm whose subscription is unpaid 14 days after the first failed payment becomes read-only (README,
 * Payments): every other write answers 403 in plain words, and nothing is deleted. Paying clears it at once.
 */
export async function assertFirmWritable(deps: AppDeps, actor: Actor, route: RouteDefinition): Promise<void> {
  if (route.method === 'get' || allowedWhileReadOnly.has(`${route.method} ${route.path}`)) return;
  const failedAt = await findPaymentFailedAt(deps.db, actor.firmId);
  if (isFirmReadOnly(failedAt, deps.clock.now())) throw new HttpError(403, firmReadOnlyMessage, 'FirmReadOnly');
}
