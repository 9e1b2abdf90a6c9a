import { ForbiddenError } from '@casl/ability';
import type { RecordInspectionInput } from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { notFound, ruleBroken } from '../../lib/http-error.ts';
import { firmToday } from '../firms/firm-today.ts';

/** Records an inspection; a failed one marks the item as needing attention. */
export async function recordInspection(trx: Knex.Transaction, deps: AppDeps, actor: Actor, itemId: number, input: RecordInspectionInput): Promise<number> {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Inspection');
  const item = await trx('kit_items').where({ firm_id: actor.firmId, id: itemId }).forUpdate().first('id', 'in_service_since');
  if (!item) throw notFound('That item');
  const today = await firmToday(trx, actor.firmId, deps.clock.now());
  const on = input.inspectedOn ?? today;
  if (on > today) throw ruleBroken(`An inspection cannot be dated in the future (${on}).`, [{ path: 'inspectedOn', message: 'Use today or an earlier day.' }]);
  if (input.photoId !== undefined && !(await trx('photos').where({ firm_id: actor.firmId, id: input.photoId }).first('id'))) throw notFound('That photo');
  const [id] = await trx('inspections').insert({
    firm_id: actor.firmId,
    item_id: itemId,
    result: input.result,
    notes: input.notes ?? null,
    photo_id: input.photoId ?? null,
    by_user_id: actor.userId,
    inspected_on: on,
    created_at: deps.clock.now(),
  });
  if (input.result === 'failed') await trx('kit_items').where({ firm_id: actor.firmId, id: itemId }).update({ condition: 'needs_attention' });
  if (input.photoId !== undefined) await trx('photos').where({ firm_id: actor.firmId, id: input.photoId }).whereNull('item_id').update({ item_id: itemId });
  return id as number;
}
