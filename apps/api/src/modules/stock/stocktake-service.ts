import { ForbiddenError } from '@casl/ability';
import { zeroesWholePlace, type StocktakeInput } from '@heatfleet/domain';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { HttpError, ruleBroken } from '../../lib/http-error.ts';
import { findBatchByLot, insertBatch } from './product-dal.ts';
import { ukDay } from './receiving-service.ts';
import { balancesAt, findBalanceQuantity } from './stock-ledger-dal.ts';
import { applyMovements, type MovementLine } from './stock-ledger.ts';
import { batch, place, product, type Trx } from './stock-service.ts';

/**
 * A stocktake: each counted batch's difference from the balance becomes an adjustment, and a lot
 * found on the shelf that is not on record here (its product, lot and expiry) is counted in. A count
 * that would leave a place holding stock with none at all is recorded only with `confirmZeroing`.
 */
export async function recordStocktake(trx: Trx, deps: AppDeps, actor: Actor, input: StocktakeInput): Promise<string> {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Stock');
  const loc = await place(trx, actor, input.locationId);
  const counted = new Map<number, number>();
  const lines: MovementLine[] = [];
  const count = async (batchId: number, productId: number, n: number, what: string) => {
    if (counted.has(batchId)) throw ruleBroken(`${what} is counted twice; count each lot once.`);
    counted.set(batchId, n);
    const onHand = await findBalanceQuantity(trx, actor.firmId, loc.id, batchId, { forUpdate: true });
    const diff = n - (onHand ?? 0);
    if (diff !== 0)
      lines.push({
        kind: 'counted',
        locationId: loc.id,
        productId,
        batchId,
        quantityDelta: diff,
        reason: input.note ?? 'Stocktake',
      });
  };
  for (const c of input.counts) {
    const b = await batch(trx, actor, c.batchId);
    await count(b.id, b.product_id, c.counted, `Lot ${b.lot_number}`);
  }
  for (const [i, f] of input.found.entries()) {
    const p = await product(trx, actor, f.productId);
    const existing = await findBatchByLot(trx, actor.firmId, p.id, f.lotNumber);
    if (existing && existing.expires_on !== f.expiresOn)
      throw ruleBroken(
        `Lot ${f.lotNumber} of ${p.name} is recorded with expiry ${ukDay(existing.expires_on)}, not ${ukDay(f.expiresOn)}.`,
        [{ path: `found.${i}.expiresOn`, message: `Lot ${f.lotNumber} expires ${ukDay(existing.expires_on)}` }],
      );
    const batchId =
      existing?.id ??
      (await insertBatch(trx, actor.firmId, { productId: p.id, lotNumber: f.lotNumber, expiresOn: f.expiresOn }));
    await count(batchId, p.id, f.counted, `Lot ${f.lotNumber} of ${p.name}`);
  }
  if (input.found.length === 0 && !input.confirmZeroing) {
    const held = (await balancesAt(trx, actor.firmId, loc.id)).map((b) => ({
      batchId: b.batch_id,
      quantity: b.quantity,
    }));
    if (zeroesWholePlace(held, counted))
      throw new HttpError(
        422,
        `This count leaves ${loc.name} with no stock at all (${held.length} lot${held.length === 1 ? '' : 's'} counted to 0). Confirm to record it. Nothing was changed.`,
        'ConfirmZeroing',
        [{ path: 'confirmZeroing', message: 'Confirm the place is empty.' }],
      );
  }
  return applyMovements(trx, actor.firmId, actor.userId, lines, deps.clock.now());
}
