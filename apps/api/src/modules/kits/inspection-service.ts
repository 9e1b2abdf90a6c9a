import { ForbiddenError } from '@casl/ability';
import {
  electricalTestOutcome,
  type InspectionRecordedResponse,
  type ItemCondition,
  type RecordInspectionInput,
} from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { notFound, ruleBroken } from '../../lib/http-error.ts';
import { runIdempotent, type IdempotencyKey } from '../../lib/idempotency.ts';
import { firmToday } from '../firms/firm-today.ts';
import { findItemKind } from '../item-kinds/item-kind-dal.ts';
import { attachPhotoToItem, photoExists } from '../photos/photo-dal.ts';
import { insertElectricalTest, insertInspection, listInspections } from './inspection-dal.ts';
import { findItemKindId, updateItems } from './kit-item-dal.ts';
import { getItem } from './kit-item-service.ts';

/**
 * The electrical test's rules: only on an electrical kind; the result sent must agree with the test's
 * outcome; the tester calibrated no later than the day of the test. Answers the condition a failed
 * test leaves the item in (out of service: the IET Code of Practice has failed equipment withdrawn).
 */
async function checkElectrical(
  trx: Knex.Transaction,
  firmId: number,
  kindId: number,
  input: RecordInspectionInput,
  on: string,
): Promise<ItemCondition | null> {
  const test = input.electrical;
  if (!test) return null;
  const kind = await findItemKind(trx, firmId, kindId);
  if (!kind?.electrical)
    throw ruleBroken(`${kind?.name ?? 'This kind'} is not an electrical kind, so it has no electrical test.`, [
      { path: 'electrical', message: 'Not an electrical kind' },
    ]);
  if (test.testerCalibratedOn > on)
    throw ruleBroken(`The tester's calibration date (${test.testerCalibratedOn}) is after the test (${on}).`, [
      { path: 'electrical.testerCalibratedOn', message: 'After the test' },
    ]);
  const outcome = electricalTestOutcome(test);
  if (outcome.result === 'fail' && input.result === 'passed')
    throw ruleBroken(`The electrical test failed (${outcome.failures.join(' ')}) Record the inspection as failed.`, [
      { path: 'result', message: 'The electrical test failed: record the inspection as failed.' },
    ]);
  return outcome.result === 'fail' ? 'out_of_service' : null;
}

/**
 * Writes an inspection; a failed one marks the item as needing attention, and a failed electrical
 * test takes it out of service.
 */
async function writeInspection(
  trx: Knex.Transaction,
  deps: AppDeps,
  actor: Actor,
  itemId: number,
  input: RecordInspectionInput,
): Promise<number> {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Inspection');
  const kindId = await findItemKindId(trx, actor.firmId, itemId, { forUpdate: true });
  if (kindId === undefined) throw notFound('That item');
  const today = await firmToday(trx, actor.firmId, deps.clock.now());
  const on = input.inspectedOn ?? today;
  if (on > today)
    throw ruleBroken(`An inspection cannot be dated in the future (${on}).`, [
      { path: 'inspectedOn', message: 'Use today or an earlier day.' },
    ]);
  const electricalCondition = await checkElectrical(trx, actor.firmId, kindId, input, on);
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
  if (input.electrical) await insertElectricalTest(trx, actor.firmId, id, input.electrical);
  const condition = electricalCondition ?? (input.result === 'failed' ? 'needs_attention' : null);
  if (condition) await updateItems(trx, actor.firmId, [itemId], { condition });
  if (input.photoId !== undefined) await attachPhotoToItem(trx, actor.firmId, input.photoId, itemId);
  return id;
}

/**
 * The check-in's "cleaned" tick: a passed inspection per item, dated the firm's today and stamped with
 * the check-in's own time, so the check-in itself (the use just ended) is not counted after it.
 */
export async function recordCleanedAtCheckIn(
  trx: Knex.Transaction,
  deps: AppDeps,
  actor: Actor,
  itemIds: number[],
  at: Date,
): Promise<void> {
  if (itemIds.length === 0) return;
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Inspection');
  const today = await firmToday(trx, actor.firmId, at);
  for (const itemId of itemIds) {
    await insertInspection(trx, {
      firm_id: actor.firmId,
      item_id: itemId,
      result: 'passed',
      notes: 'Cleaned after use (ticked at check-in).',
      photo_id: null,
      by_user_id: actor.userId,
      inspected_on: today,
      created_at: at,
      cleaned_at_check_in: true,
    });
  }
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
