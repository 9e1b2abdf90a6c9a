import { ForbiddenError, subject } from '@casl/ability';
import { allocateFefo, isExpired, type TransferInput, type UsageInput, type WriteOffInput } from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { conflict, HttpError, notAllowed, notFound, ruleBroken } from '../../lib/http-error.ts';
import { findLocation, type LocationRow } from '../locations/location-dal.ts';
import { firmToday } from '../firms/firm-today.ts';
import { findBatch, findProductRef, type BatchRow } from './product-dal.ts';
import { anyReversed, balancesAt, findMovementForUpdate, listGroupMovementsForUpdate } from './stock-ledger-dal.ts';
import { applyMovements, type MovementLine } from './stock-ledger.ts';

export type Trx = Knex.Transaction;

export async function place(trx: Trx, actor: Actor, id: number, what: 'depot' | 'any' = 'any'): Promise<LocationRow> {
  const loc = await findLocation(trx, actor.firmId, id);
  if (!loc || !loc.active || (what === 'depot' && loc.kind !== 'depot'))
    throw notFound(what === 'depot' ? 'That depot' : 'That place');
  return loc;
}

export async function product(trx: Trx, actor: Actor, id: number): Promise<{ id: number; name: string }> {
  const p = await findProductRef(trx, actor.firmId, id);
  if (!p) throw notFound('That product');
  return p;
}

export async function batch(trx: Trx, actor: Actor, id: number): Promise<BatchRow> {
  const b = await findBatch(trx, actor.firmId, id);
  if (!b) throw notFound('That batch');
  return b;
}

function refuseExpired(b: { lot_number: string; expires_on: string }, today: string, doing: string) {
  if (isExpired({ expiresOn: b.expires_on }, today)) {
    throw new HttpError(
      409,
      `Lot ${b.lot_number} expired on ${b.expires_on}: it cannot be ${doing}, only written off.`,
      'BatchExpired',
    );
  }
}

/** Moves stock between places; a line without a batch is taken first expiry first. */
export async function transferStock(trx: Trx, deps: AppDeps, actor: Actor, input: TransferInput): Promise<string> {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Stock');
  const [from, to] = [await place(trx, actor, input.fromLocationId), await place(trx, actor, input.toLocationId)];
  const today = await firmToday(trx, actor.firmId, deps.clock.now());
  const lines: MovementLine[] = [];
  for (const line of input.lines) {
    const p = await product(trx, actor, line.productId);
    let picks: { batchId: number; quantity: number }[];
    if (line.batchId) {
      const b = await batch(trx, actor, line.batchId);
      if (b.product_id !== p.id) throw ruleBroken(`Lot ${b.lot_number} is not a batch of ${p.name}.`);
      refuseExpired(b, today, 'transferred');
      picks = [{ batchId: b.id, quantity: line.quantity }];
    } else {
      const stock = (await balancesAt(trx, actor.firmId, from.id, p.id)).map((s) => ({
        batchId: s.batch_id,
        lotNumber: s.lot_number,
        expiresOn: s.expires_on,
        quantity: s.quantity,
      }));
      const plan = allocateFefo(stock, line.quantity, today);
      if (plan.shortfall > 0) {
        const usable = line.quantity - plan.shortfall;
        throw conflict(
          `Only ${usable} usable pack${usable === 1 ? '' : 's'} of ${p.name} at ${from.name}; ${line.quantity} asked for. Nothing was moved.`,
        );
      }
      picks = plan.allocations;
    }
    for (const pick of picks) {
      lines.push({
        kind: 'transfer_out',
        locationId: from.id,
        productId: p.id,
        batchId: pick.batchId,
        quantityDelta: -pick.quantity,
        reason: input.note ?? null,
      });
      lines.push({
        kind: 'transfer_in',
        locationId: to.id,
        productId: p.id,
        batchId: pick.batchId,
        quantityDelta: pick.quantity,
        reason: input.note ?? null,
      });
    }
  }
  return applyMovements(trx, actor.firmId, actor.userId, lines, deps.clock.now());
}

/** Stock used by hand (not on a job), first expiry first unless a batch is named. */
export async function useStock(
  trx: Trx,
  deps: AppDeps,
  actor: Actor,
  input: UsageInput,
  given: { tappedAt?: Date | null } = {},
): Promise<string> {
  const loc = await place(trx, actor, input.locationId);
  if (
    actor.ability.cannot(
      'create',
      subject('StockUse', { firmId: actor.firmId, kind: loc.kind, engineerMemberId: loc.engineer_member_id }),
    )
  ) {
    throw notAllowed('You can record stock used from your own van only.');
  }
  const p = await product(trx, actor, input.productId);
  const today = await firmToday(trx, actor.firmId, deps.clock.now());
  let picks: { batchId: number; quantity: number }[];
  if (input.batchId) {
    const b = await batch(trx, actor, input.batchId);
    if (b.product_id !== p.id) throw ruleBroken(`Lot ${b.lot_number} is not a batch of ${p.name}.`);
    refuseExpired(b, today, 'used');
    picks = [{ batchId: b.id, quantity: input.quantity }];
  } else {
    const stock = (await balancesAt(trx, actor.firmId, loc.id, p.id)).map((s) => ({
      batchId: s.batch_id,
      lotNumber: s.lot_number,
      expiresOn: s.expires_on,
      quantity: s.quantity,
    }));
    const plan = allocateFefo(stock, input.quantity, today);
    if (plan.shortfall > 0) {
      const usable = input.quantity - plan.shortfall;
      throw conflict(
        `Only ${usable} usable pack${usable === 1 ? '' : 's'} of ${p.name} at ${loc.name}; ${input.quantity} asked for. Nothing was used.`,
      );
    }
    // Read without a lock: if another request takes the same packs first, the conditional update refuses.
    picks = plan.allocations;
  }
  return applyMovements(
    trx,
    actor.firmId,
    actor.userId,
    picks.map((pick) => ({
      kind: 'used' as const,
      locationId: loc.id,
      productId: p.id,
      batchId: pick.batchId,
      quantityDelta: -pick.quantity,
      reason: input.reason,
      tappedAt: given.tappedAt ?? null,
    })),
    deps.clock.now(),
  );
}

export async function writeOff(trx: Trx, deps: AppDeps, actor: Actor, input: WriteOffInput): Promise<string> {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Stock');
  const loc = await place(trx, actor, input.locationId);
  const b = await batch(trx, actor, input.batchId);
  return applyMovements(
    trx,
    actor.firmId,
    actor.userId,
    [
      {
        kind: 'written_off',
        locationId: loc.id,
        productId: b.product_id,
        batchId: b.id,
        quantityDelta: -input.quantity,
        reason: [input.reason, input.note].filter(Boolean).join(': '),
      },
    ],
    deps.clock.now(),
  );
}

/** Undoes a movement by a new one of the opposite sign that points at it; each may be reversed once. */
export async function reverseMovement(
  trx: Trx,
  deps: AppDeps,
  actor: Actor,
  movementId: number,
  reason: string,
): Promise<string> {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Stock');
  const m = await findMovementForUpdate(trx, actor.firmId, movementId);
  if (!m) throw notFound('That movement');
  if (m.kind === 'reversal') throw ruleBroken('A reversal cannot itself be reversed; record a new movement instead.');
  // A transfer is undone as a whole: both its legs.
  const legs =
    m.kind === 'transfer_out' || m.kind === 'transfer_in'
      ? await listGroupMovementsForUpdate(trx, actor.firmId, m.group_id)
      : [m];
  if (
    await anyReversed(
      trx,
      actor.firmId,
      legs.map((l) => l.id),
    )
  )
    throw conflict('That movement has already been reversed.');
  return applyMovements(
    trx,
    actor.firmId,
    actor.userId,
    legs.map((l) => ({
      kind: 'reversal' as const,
      locationId: l.location_id,
      productId: l.product_id,
      batchId: l.batch_id,
      quantityDelta: -l.quantity_delta,
      reason,
      reversesMovementId: l.id,
    })),
    deps.clock.now(),
  );
}
