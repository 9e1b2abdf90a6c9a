import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import { HttpError } from '../../lib/http-error.ts';
import {
  decreaseBalance,
  describeStockAt,
  findBalanceQuantity,
  increaseBalance,
  insertMovements,
  type MovementKind,
} from './stock-ledger-dal.ts';

export type { MovementKind } from './stock-ledger-dal.ts';
// Jobs and reminders read balances through here; the query itself lives in the data-access file.
export { balancesAt } from './stock-ledger-dal.ts';

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
  /** When the engineer tapped (X-Tapped-At), for stock used by hand. */
  tappedAt?: Date | null;
}

/** Describes a place, product and batch in words, for a refusal. */
async function describe(trx: Knex.Transaction, firmId: number, line: MovementLine): Promise<string> {
  const row = await describeStockAt(trx, firmId, line.batchId, line.locationId);
  return row ? `${row.product} (lot ${row.lot}) at ${row.place}` : 'that stock';
}

/**
 * Writes movements to the ledger and moves the running balances with them, in the caller's
 * transaction. A decrease is a conditional update that only succeeds while the balance stays at
 * or above zero, so two requests racing for the last pack cannot both have it; the loser gets 409
 * with what is on hand. Lines are applied in (place, batch) order so concurrent multi-line
 * movements take their row locks in the same order.
 */
export async function applyMovements(
  trx: Knex.Transaction,
  firmId: number,
  userId: number,
  lines: MovementLine[],
  now: Date,
  groupId = randomUUID(),
): Promise<string> {
  const ordered = [...lines].sort((a, b) => a.locationId - b.locationId || a.batchId - b.batchId);
  for (const line of ordered) {
    if (line.quantityDelta === 0) continue;
    if (line.quantityDelta < 0) {
      if (!(await decreaseBalance(trx, firmId, line.locationId, line.batchId, line.quantityDelta))) {
        const onHand = (await findBalanceQuantity(trx, firmId, line.locationId, line.batchId)) ?? 0;
        throw new HttpError(
          409,
          `Only ${onHand} pack${onHand === 1 ? '' : 's'} of ${await describe(trx, firmId, line)} on hand; ${-line.quantityDelta} asked for. Nothing was moved.`,
          'NotEnoughStock',
          [{ path: `batch:${line.batchId}`, message: `${onHand} on hand` }],
        );
      }
    } else {
      await increaseBalance(trx, firmId, line.locationId, line.batchId, line.productId, line.quantityDelta);
    }
  }
  const written = lines.filter((l) => l.quantityDelta !== 0);
  // A stocktake that matches every balance changes nothing and writes nothing.
  if (written.length === 0) return groupId;
  await insertMovements(
    trx,
    firmId,
    written.map((l) => ({
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
      tapped_at: l.tappedAt ?? null,
    })),
  );
  return groupId;
}
