import { ForbiddenError } from '@casl/ability';
import type { InspectionRecordedResponse, RecordInspectionInput } from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { notFound, ruleBroken } from '../../lib/http-error.ts';
import { runIdempotent, type IdempotencyKey } from '../../lib/idempotency.ts';
import { firmToday } from '../firms/firm-today.ts';
import { attachPhotoToItem, photoExists } from '../photos/photo-dal.ts';
import { insertInspection, listInspections } from './inspection-dal.ts';
import { findItemId, updateItems } from './kit-item-dal.ts';
import { getItem } from './kit-item-service.ts';

/** Writes an inspection; a failed one marks the item as needing attention. */
async function writeInspection(
  trx: Knex.Transaction,
  deps: AppDeps,
  actor: Actor,
  itemId: number,
  input: RecordInspectionInput,
): Promise<number> {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Inspection');
  if (!(await findItemId(trx, actor.firmId, itemId, { forUpdate: true }))) throw notFound('That item');
  const today = await firmToday(trx, actor.firmId, deps.clock.now());
  const on = input.inspectedOn ?? today;
  if (on > today)
    throw ruleBroken(`An inspection cannot be dated in the future (${on}).`, [
      { path: 'inspectedOn', message: 'Use today or an earlier day.' },
    ]);
  if (input.photoId !== undefined && !(await photoExists(trx, actor.firmId, input.photoId)))
    throw notFound('That photo');
  const id = await insertInspection(trx, {
    firm_id: actor.firmId,
    item_id: itemId,
    result: input.result,
    notes: input.notes ?? null,
    photo_id: input.photoId ?? null,
    by_user_id: actor.userId,
    inspected_on: on,
    created_at: deps.clock.now(),
  });
  if (input.result === 'failed') await updateItems(trx, actor.firmId, [itemId], { condition: 'needs_attention' });
  if (input.photoId !== undefined) await attachPhotoToItem(trx, actor.firmId, input.photoId, itemId);
  return id;
}

/**
 * Records an inspection, idempotent by key (a retry with the same key replays the first answer),
 * answering with the inspection and the item as it now stands.
 */
export async function recordInspection(
  deps: AppDeps,
  actor: Actor,
  itemId: number,
  input: RecordInspectionInput,
  idempotencyKey: IdempotencyKey | undefined,
): Promise<{ status: number; body: InspectionRecordedResponse }> {
  return runIdempotent(deps, actor, idempotencyKey, `inspect item ${itemId}`, async (trx) => {
    const id = await writeInspection(trx, deps, actor, itemId, input);
    const item = await getItem(deps, actor, itemId, trx);
    const inspection = (await listInspections(trx, actor.firmId, [itemId])).find((i) => i.id === id)!;
    return { status: 201, body: { inspection, item } };
  });
}
