import { ForbiddenError } from '@casl/ability';
import {
  DEFAULT_MIN_SHELF_LIFE_DAYS,
  lotLifeAtReceipt,
  type ApiErrorDetail,
  type ReceiptInput,
} from '@heatfleet/domain';
import type { AppDeps, Actor } from '../../app-deps.ts';
import { HttpError, ruleBroken } from '../../lib/http-error.ts';
import { firmToday } from '../firms/firm-today.ts';
import { findBatchByLot, insertBatch, listMinShelfLifeDays } from './product-dal.ts';
import { applyMovements, type MovementLine } from './stock-ledger.ts';
import { place, product, type Trx } from './stock-service.ts';

/** A calendar day as people read it: 31 January 2027. */
export function ukDay(day: string): string {
  return new Intl.DateTimeFormat('en-GB', { timeZone: 'UTC', day: 'numeric', month: 'long', year: 'numeric' }).format(
    new Date(`${day}T00:00:00Z`),
  );
}

/**
 * Checks each line's lot against its product's minimum remaining life: an expired lot is never
 * received (it is written off instead), a lot with less life left than the minimum only when the
 * person confirmed it (`confirmShortLife`). Both refusals name the lines, so a form can show them.
 */
export async function checkLotLife(trx: Trx, firmId: number, input: ReceiptInput, today: string): Promise<void> {
  const minDays = await listMinShelfLifeDays(trx, firmId, [...new Set(input.lines.map((l) => l.productId))]);
  const expired: ApiErrorDetail[] = [];
  const short: ApiErrorDetail[] = [];
  input.lines.forEach((line, i) => {
    const min = minDays.get(line.productId) ?? DEFAULT_MIN_SHELF_LIFE_DAYS;
    const life = lotLifeAtReceipt(line.expiresOn, today, min);
    const path = `lines.${i}.expiresOn`;
    if (life.state === 'expired')
      expired.push({
        path,
        message: `Lot ${line.lotNumber} expired on ${ukDay(line.expiresOn)}: write it off instead.`,
      });
    else if (life.state === 'short')
      short.push({
        path,
        message: `Lot ${line.lotNumber} has ${life.daysLeft} day${life.daysLeft === 1 ? '' : 's'} of use left, under the ${min} days this product should have.`,
      });
  });
  if (expired.length)
    throw new HttpError(
      422,
      `${expired.map((e) => e.message.replace(/: write it off instead\.$/, '')).join('; ')}: an expired lot cannot be received. Write it off instead. Nothing was received.`,
      'LotExpired',
      expired,
    );
  if (short.length && !input.confirmShortLife)
    throw new HttpError(
      422,
      `${short.map((s) => s.message).join(' ')} Confirm to receive it anyway. Nothing was received yet.`,
      'ShortShelfLife',
      short,
    );
}

/** A delivery to a depot: each line names its batch (made on first sight) and expiry. */
export async function receiveDelivery(trx: Trx, deps: AppDeps, actor: Actor, input: ReceiptInput): Promise<string> {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Stock');
  const depot = await place(trx, actor, input.locationId, 'depot');
  for (const line of input.lines) await product(trx, actor, line.productId);
  await checkLotLife(trx, actor.firmId, input, await firmToday(trx, actor.firmId, deps.clock.now()));
  const lines: MovementLine[] = [];
  for (const line of input.lines) {
    const existing = await findBatchByLot(trx, actor.firmId, line.productId, line.lotNumber);
    if (existing && existing.expires_on !== line.expiresOn) {
      throw ruleBroken(
        `Lot ${line.lotNumber} is already recorded with expiry ${ukDay(existing.expires_on)}, not ${ukDay(line.expiresOn)}.`,
        [{ path: 'expiresOn', message: `Lot ${line.lotNumber} expires ${ukDay(existing.expires_on)}` }],
      );
    }
    const batchId = existing?.id ?? (await insertBatch(trx, actor.firmId, line));
    lines.push({
      kind: 'received',
      locationId: depot.id,
      productId: line.productId,
      batchId,
      quantityDelta: line.quantity,
      reference: input.reference ?? null,
    });
  }
  return applyMovements(trx, actor.firmId, actor.userId, lines, deps.clock.now());
}
