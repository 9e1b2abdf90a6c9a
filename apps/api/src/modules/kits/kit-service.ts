import { ForbiddenError } from '@casl/ability';
import type { CreateKitInput, Kit, KitDetailResponse, KitItem } from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { conflict, notFound } from '../../lib/http-error.ts';
import { listCustodyEvents } from './custody-dal.ts';
import { listInspections } from './inspection-dal.ts';
import { findKit, insertKit, kitNameTaken, listKitRows, updateKitRow, type KitRow } from './kit-dal.ts';
import { inspectionStateRank, loadItems } from './kit-item-service.ts';

type Db = Knex | Knex.Transaction;

/** A kit is where most of its items are; its state is its worst item's. */
export function summariseKit(kit: KitRow, items: KitItem[]): Kit {
  const counts = new Map<number, { n: number; ref: NonNullable<KitItem['location']> }>();
  for (const i of items) {
    if (!i.location) continue;
    const c = counts.get(i.location.id) ?? { n: 0, ref: i.location };
    c.n += 1;
    counts.set(i.location.id, c);
  }
  const where = [...counts.values()].sort((a, b) => b.n - a.n)[0]?.ref ?? null;
  const worst = items.reduce<Kit['inspectionState']>(
    (w, i) => (inspectionStateRank[i.inspection.state] > inspectionStateRank[w] ? i.inspection.state : w),
    'no_rule',
  );
  return {
    id: kit.id,
    name: kit.name,
    notes: kit.notes,
    location: where,
    itemCount: items.length,
    inspectionState: worst,
    needsAttention: items.filter((i) => i.condition !== 'in_service').length,
  };
}

export async function listKits(deps: AppDeps, actor: Actor, db: Db = deps.db): Promise<Kit[]> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Kit');
  const [kits, items] = await Promise.all([
    listKitRows(db, actor.firmId),
    loadItems(db, actor.firmId, deps.clock.now(), { inKit: true }),
  ]);
  const byKit = new Map<number, KitItem[]>();
  for (const i of items) if (i.kit) byKit.set(i.kit.id, [...(byKit.get(i.kit.id) ?? []), i]);
  return kits.map((k) => summariseKit(k, byKit.get(k.id) ?? []));
}

export async function getKitDetail(
  deps: AppDeps,
  actor: Actor,
  id: number,
  db: Db = deps.db,
): Promise<KitDetailResponse> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Kit');
  const kit = await findKit(db, actor.firmId, id);
  if (!kit) throw notFound('That kit');
  const items = await loadItems(db, actor.firmId, deps.clock.now(), { kitId: id });
  const [events, inspections] = await Promise.all([
    listCustodyEvents(db, actor.firmId, { kitId: id }),
    listInspections(
      db,
      actor.firmId,
      items.map((i) => i.id),
    ),
  ]);
  return { kit: summariseKit(kit, items), items, events, inspections };
}

export async function createKit(deps: AppDeps, actor: Actor, input: CreateKitInput): Promise<Kit> {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Kit');
  const id = await deps.db.transaction(async (trx) => {
    if (await kitNameTaken(trx, actor.firmId, input.name))
      throw conflict(`There is already a kit called "${input.name}".`);
    return insertKit(trx, actor.firmId, { name: input.name, notes: input.notes ?? null });
  });
  return (await getKitDetail(deps, actor, id)).kit;
}

export async function updateKit(deps: AppDeps, actor: Actor, id: number, input: Partial<CreateKitInput>): Promise<Kit> {
  ForbiddenError.from(actor.ability).throwUnlessCan('update', 'Kit');
  await deps.db.transaction(async (trx) => {
    const kit = await findKit(trx, actor.firmId, id, { forUpdate: true });
    if (!kit) throw notFound('That kit');
    if (input.name && input.name !== kit.name && (await kitNameTaken(trx, actor.firmId, input.name))) {
      throw conflict(`There is already a kit called "${input.name}".`);
    }
    await updateKitRow(trx, actor.firmId, id, {
      ...(input.name !== undefined && { name: input.name }),
      ...(input.notes !== undefined && { notes: input.notes }),
    });
  });
  return (await getKitDetail(deps, actor, id)).kit;
}
