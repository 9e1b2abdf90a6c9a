import { ForbiddenError } from '@casl/ability';
import type { ItemKind, ItemKindInput } from '@heatfleet/domain';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { conflict, notFound, ruleBroken } from '../../lib/http-error.ts';
import {
  findItemKind,
  findItemKindByName,
  insertItemKind,
  listItemKinds as listRows,
  updateItemKind as updateRow,
} from './item-kind-dal.ts';

function checkRule(kind: Partial<ItemKindInput>) {
  if (kind.intervalDays === null && kind.intervalUses === null) return;
  if (
    kind.intervalDays !== undefined &&
    kind.intervalDays !== null &&
    kind.dueSoonDays !== undefined &&
    kind.dueSoonDays >= kind.intervalDays
  ) {
    throw ruleBroken(
      `The due-soon window (${kind.dueSoonDays} days) must be shorter than the interval (${kind.intervalDays} days).`,
      [{ path: 'dueSoonDays', message: 'Make it shorter than the days between inspections.' }],
    );
  }
}

export async function listItemKinds(deps: AppDeps, actor: Actor): Promise<ItemKind[]> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'ItemKind');
  return listRows(deps.db, actor.firmId);
}

export async function createItemKind(deps: AppDeps, actor: Actor, input: ItemKindInput): Promise<ItemKind> {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'ItemKind');
  checkRule(input);
  const id = await deps.db.transaction(async (trx) => {
    if (await findItemKindByName(trx, actor.firmId, input.name))
      throw conflict(`There is already a kind called "${input.name}".`);
    return insertItemKind(trx, actor.firmId, input);
  });
  return (await findItemKind(deps.db, actor.firmId, id))!;
}

export async function updateItemKind(
  deps: AppDeps,
  actor: Actor,
  id: number,
  input: Partial<ItemKindInput>,
): Promise<ItemKind> {
  ForbiddenError.from(actor.ability).throwUnlessCan('update', 'ItemKind');
  await deps.db.transaction(async (trx) => {
    const current = await findItemKind(trx, actor.firmId, id);
    if (!current) throw notFound('That kind of item');
    checkRule({ ...current, ...input });
    if (input.name && input.name !== current.name && (await findItemKindByName(trx, actor.firmId, input.name))) {
      throw conflict(`There is already a kind called "${input.name}".`);
    }
    await updateRow(trx, actor.firmId, id, input);
  });
  return (await findItemKind(deps.db, actor.firmId, id))!;
}
