import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import { HttpError } from '../../lib/http-error.ts';

export type MovementKind = 'received' | 'transfer_out' | 'transfer_in' | 'used' | 'counted' | 'written_off' | 'reversal';

export interface MovementLine {
  kind: MovementKind;
  locationId: number;
  productId: number;
  batchId: number;
  quantityDelta: number;
  reason?: string | null;
  reference?: string | null;
  reversesMovementId?: number | null;
  jobId?: number | null;
}

export interface Balance {
  location_id: number;
  batch_id: number;
  product_id: number;
  quantity: number;
}

/** Describes a place, product and batch in words, for a refusal. */
async function describe(trx: Knex.Transaction, firmId: number, line: MovementLine): Promise<string> {
  const row = await trx('product_batches as b')
    .join('products as p', 'p.id', 'b.product_id')
    .join('locations as l', (j) => j.on('l.firm_id', '=', 'b.firm_id'))
    .where({ 'b.firm_id': firmId, 'b.id': line.batchId, 'l.id': line.locationId })
    .first('p.name as product', 'b.lot_number as lot', 'l.name as place');
  return row ? `${row.product} (lot ${row.lot}) at ${row.place}` : 'that stock';
}

/**
 * Writes movements to the ledger and moves the running balances with them, in the caller's
 * transaction. A decrease is a conditional update that only succeeds while the balance stays at
 * or above zero, so two requests racing for the last pack cannot both have it; the loser gets 409
 * with what is on hand. Lines are applied in (place, batch) order so concurrent multi-line
 * movements take their row locks in the same order.
 */
export async function applyMovements(trx: Knex.Transaction, firmId: number, userId: number, lines: MovementLine[], now: Date, groupId = randomUUID()): Promise<string> {
  const ordered = [...lines].sort((a, b) => a.locationId - b.locationId || a.batchId - b.batchId);
  for (const line of ordered) {
    if (line.quantityDelta === 0) continue;
    if (line.quantityDelta < 0) {
      const changed = await trx('stock_balances')
        .where({ firm_id: firmId, location_id: line.locationId, batch_id: line.batchId })
        .andWhereRaw('quantity + ? >= 0', [line.quantityDelta])
        .update({ quantity: trx.raw('quantity + ?', [line.quantityDelta]) });
      if (changed !== 1) {
        const bal = (await trx('stock_balances').where({ firm_id: firmId, location_id: line.locationId, batch_id: line.batchId }).first('quantity')) as { quantity: number } | undefined;
        const onHand = bal?.quantity ?? 0;
        throw new HttpError(409, `Only ${onHand} pack${onHand === 1 ? '' : 's'} of ${await describe(trx, firmId, line)} on hand; ${-line.quantityDelta} asked for. Nothing was moved.`, 'NotEnoughStock', [
          { path: `batch:${line.batchId}`, message: `${onHand} on hand` },
        ]);
      }
    } else {
      await trx.raw(
        'INSERT INTO stock_balances (firm_id, location_id, batch_id, product_id, quantity) VALUES (?, ?, ?, ?, ?) ON DUPLICATE KEY UPDATE quantity = quantity + VALUES(quantity)',
        [firmId, line.locationId, line.batchId, line.productId, line.quantityDelta],
      );
    }
  }
  const written = lines.filter((l) => l.quantityDelta !== 0);
  // A stocktake that matches every balance changes nothing and writes nothing.
  if (written.length === 0) return groupId;
  await trx('stock_movements').insert(
    written.map((l) => ({
      firm_id: firmId,
      group_id: groupId,
      kind: l.kind,
      location_id: l.locationId,
      product_id: l.productId,
      batch_id: l.batchId,
      quantity_delta: l.quantityDelta,
      reason: l.reason ?? null,
      reference: l.reference ?? null,
      reverses_movement_id: l.reversesMovementId ?? null,
      job_id: l.jobId ?? null,
      by_user_id: userId,
      created_at: now,
    })),
  );
  return groupId;
}

/** Balances at a place, with batch expiry, for allocation. */
export async function balancesAt(db: Knex | Knex.Transaction, firmId: number, locationId: number, productId?: number) {
  const q = db('stock_balances as s')
    .join('product_batches as b', (j) => j.on('b.id', '=', 's.batch_id').andOn('b.firm_id', '=', 's.firm_id'))
    .where({ 's.firm_id': firmId, 's.location_id': locationId })
    .where('s.quantity', '>', 0)
    .select('s.batch_id', 's.product_id', 's.quantity', 'b.lot_number', 'b.expires_on');
  if (productId !== undefined) q.where('s.product_id', productId);
  return q as Promise<{ batch_id: number; product_id: number; quantity: number; lot_number: string; expires_on: string }[]>;
}
