import { ForbiddenError } from '@casl/ability';
import {
  inspectionDue,
  type CreateKitInput,
  type CreateKitItemInput,
  type Kit,
  type KitItem,
  type KitItemListQuery,
  type UpdateKitItemInput,
} from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { conflict, notFound } from '../../lib/http-error.ts';
import { firmToday } from '../firms/firm-today.ts';
import { findItemKind } from '../item-kinds/item-kind-dal.ts';
import { findLocation, firstDepot } from '../locations/location-dal.ts';
import { listCustodyEvents, listInspections, locationRefOf, selectItems, type ItemFilter, type ItemRow } from './kit-dal.ts';

type Db = Knex | Knex.Transaction;
const stateRank = { no_rule: 0, ok: 1, due_soon: 2, overdue: 3 } as const;

export function toKitItem(row: ItemRow, today: string): KitItem {
  const uses = Number(row.uses_since_inspection);
  const due = inspectionDue(
    { intervalDays: row.interval_days, intervalUses: row.interval_uses, dueSoonDays: row.due_soon_days },
    { lastInspectedOn: row.last_inspected_on, inServiceSince: row.in_service_since, usesSinceInspection: uses },
    today,
  );
  return {
    id: row.id,
    assetTag: row.asset_tag,
    kind: { id: row.kind_id, name: row.kind_name, overduePolicy: row.overdue_policy },
    kit: row.kit_id && row.kit_name ? { id: row.kit_id, name: row.kit_name } : null,
    serialNumber: row.serial_number,
    condition: row.condition,
    notes: row.notes,
    location: locationRefOf(row),
    inspection: { ...due, lastInspectedOn: row.last_inspected_on, usesSinceInspection: uses },
    vibrationMs2: row.vibration_ms2 == null ? null : Number(row.vibration_ms2),
  };
}

export async function loadItems(db: Db, firmId: number, now: Date, filter: ItemFilter = {}): Promise<KitItem[]> {
  const [rows, today] = await Promise.all([selectItems(db, firmId, filter), firmToday(db, firmId, now)]);
  return rows.map((r) => toKitItem(r, today));
}

export async function listItems(deps: AppDeps, actor: Actor, query: KitItemListQuery) {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'KitItem');
  const all = await loadItems(deps.db, actor.firmId, deps.clock.now(), query);
  // The due state is computed, not stored, so that filter and the paging run here.
  const filtered = query.inspectionState ? all.filter((i) => i.inspection.state === query.inspectionState) : all;
  const key: Record<KitItemListQuery['sort'], (i: KitItem) => string | number> = {
    assetTag: (i) => i.assetTag,
    kind: (i) => i.kind.name,
    kit: (i) => i.kit?.name ?? '',
    location: (i) => i.location?.name ?? '',
    // Most urgent first when ascending: overdue, then due soon, then by due day.
    due: (i) => `${3 - stateRank[i.inspection.state]}:${i.inspection.dueOn ?? '9999-12-31'}`,
  };
  const by = key[query.sort];
  const sign = query.dir === 'desc' ? -1 : 1;
  filtered.sort((a, b) => {
    const x = by(a);
    const y = by(b);
    return sign * (x < y ? -1 : x > y ? 1 : 0) || a.assetTag.localeCompare(b.assetTag);
  });
  const start = (query.page - 1) * query.pageSize;
  return { items: filtered.slice(start, start + query.pageSize), total: filtered.length, page: query.page, pageSize: query.pageSize };
}

export async function getItem(deps: AppDeps, actor: Actor, id: number, db: Db = deps.db): Promise<KitItem> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'KitItem');
  const [item] = await loadItems(db, actor.firmId, deps.clock.now(), { ids: [id] });
  if (!item) throw notFound('That item');
  return item;
}

export async function getItemDetail(deps: AppDeps, actor: Actor, id: number) {
  const item = await getItem(deps, actor, id);
  const [events, inspections, photos] = await Promise.all([
    listCustodyEvents(deps.db, actor.firmId, { itemId: id }),
    listInspections(deps.db, actor.firmId, [id]),
    deps.db('photos').where({ firm_id: actor.firmId, item_id: id }).orderBy('id', 'desc').select('id', 'content_type', 'byte_size', 'caption', 'created_at'),
  ]);
  return {
    item,
    events,
    inspections,
    photos: (photos as { id: number; content_type: string; byte_size: number; caption: string | null; created_at: Date }[]).map((p) => ({
      id: p.id,
      url: `/api/photos/${p.id}/content`,
      contentType: p.content_type,
      byteSize: p.byte_size,
      caption: p.caption,
      createdAt: p.created_at.toISOString(),
    })),
  };
}

async function checkKitExists(db: Db, firmId: number, kitId: number | null | undefined) {
  if (kitId === undefined || kitId === null) return;
  if (!(await db('kits').where({ firm_id: firmId, id: kitId }).first('id'))) throw notFound('That kit');
}

export async function createItem(deps: AppDeps, actor: Actor, input: CreateKitItemInput): Promise<KitItem> {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'KitItem');
  const today = await firmToday(deps.db, actor.firmId, deps.clock.now());
  const id = await deps.db.transaction(async (trx) => {
    if (!(await findItemKind(trx, actor.firmId, input.kindId))) throw notFound('That kind of item');
    await checkKitExists(trx, actor.firmId, input.kitId);
    const location = input.locationId ? await findLocation(trx, actor.firmId, input.locationId) : await firstDepot(trx, actor.firmId);
    if (input.locationId && !location) throw notFound('That location');
    if (await trx('kit_items').where({ firm_id: actor.firmId, asset_tag: input.assetTag }).first('id')) {
      throw conflict(`Asset tag ${input.assetTag} is already on another item.`);
    }
    const [newId] = await trx('kit_items').insert({
      firm_id: actor.firmId,
      kit_id: input.kitId ?? null,
      kind_id: input.kindId,
      asset_tag: input.assetTag,
      serial_number: input.serialNumber ?? null,
      notes: input.notes ?? null,
      location_id: location?.id ?? null,
      in_service_since: input.inServiceSince ?? today,
    });
    return newId as number;
  });
  return getItem(deps, actor, id);
}

export async function updateItem(deps: AppDeps, actor: Actor, id: number, input: UpdateKitItemInput): Promise<KitItem> {
  ForbiddenError.from(actor.ability).throwUnlessCan('update', 'KitItem');
  await deps.db.transaction(async (trx) => {
    const row = await trx('kit_items').where({ firm_id: actor.firmId, id }).forUpdate().first('id');
    if (!row) throw notFound('That item');
    if (input.kindId !== undefined && !(await findItemKind(trx, actor.firmId, input.kindId))) throw notFound('That kind of item');
    await checkKitExists(trx, actor.firmId, input.kitId);
    const patch = {
      ...(input.kindId !== undefined && { kind_id: input.kindId }),
      ...(input.kitId !== undefined && { kit_id: input.kitId }),
      ...(input.serialNumber !== undefined && { serial_number: input.serialNumber }),
      ...(input.notes !== undefined && { notes: input.notes }),
      ...(input.condition !== undefined && { condition: input.condition }),
      ...(input.vibrationMs2 !== undefined && { vibration_ms2: input.vibrationMs2 }),
    };
    if (Object.keys(patch).length) await trx('kit_items').where({ firm_id: actor.firmId, id }).update(patch);
  });
  return getItem(deps, actor, id);
}

/** A kit is where most of its items are; its state is its worst item's. */
export function summariseKit(kit: { id: number; name: string; notes: string | null }, items: KitItem[]): Kit {
  const counts = new Map<number, { n: number; ref: NonNullable<KitItem['location']> }>();
  for (const i of items) {
    if (!i.location) continue;
    const c = counts.get(i.location.id) ?? { n: 0, ref: i.location };
    c.n += 1;
    counts.set(i.location.id, c);
  }
  const where = [...counts.values()].sort((a, b) => b.n - a.n)[0]?.ref ?? null;
  const worst = items.reduce<Kit['inspectionState']>((w, i) => (stateRank[i.inspection.state] > stateRank[w] ? i.inspection.state : w), 'no_rule');
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
    db('kits').where({ firm_id: actor.firmId }).orderBy('name').select('id', 'name', 'notes') as Promise<{ id: number; name: string; notes: string | null }[]>,
    loadItems(db, actor.firmId, deps.clock.now(), { inKit: true }),
  ]);
  const byKit = new Map<number, KitItem[]>();
  for (const i of items) if (i.kit) byKit.set(i.kit.id, [...(byKit.get(i.kit.id) ?? []), i]);
  return kits.map((k) => summariseKit(k, byKit.get(k.id) ?? []));
}

export async function getKitDetail(deps: AppDeps, actor: Actor, id: number, db: Db = deps.db) {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Kit');
  const kit = (await db('kits').where({ firm_id: actor.firmId, id }).first('id', 'name', 'notes')) as { id: number; name: string; notes: string | null } | undefined;
  if (!kit) throw notFound('That kit');
  const items = await loadItems(db, actor.firmId, deps.clock.now(), { kitId: id });
  const [events, inspections] = await Promise.all([
    listCustodyEvents(db, actor.firmId, { kitId: id }),
    listInspections(db, actor.firmId, items.map((i) => i.id)),
  ]);
  return { kit: summariseKit(kit, items), items, events, inspections };
}

export async function createKit(deps: AppDeps, actor: Actor, input: CreateKitInput): Promise<Kit> {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'Kit');
  const id = await deps.db.transaction(async (trx) => {
    if (await trx('kits').where({ firm_id: actor.firmId, name: input.name }).first('id')) throw conflict(`There is already a kit called "${input.name}".`);
    const [newId] = await trx('kits').insert({ firm_id: actor.firmId, name: input.name, notes: input.notes ?? null });
    return newId as number;
  });
  return (await getKitDetail(deps, actor, id)).kit;
}

export async function updateKit(deps: AppDeps, actor: Actor, id: number, input: Partial<CreateKitInput>): Promise<Kit> {
  ForbiddenError.from(actor.ability).throwUnlessCan('update', 'Kit');
  await deps.db.transaction(async (trx) => {
    const kit = await trx('kits').where({ firm_id: actor.firmId, id }).forUpdate().first('id', 'name');
    if (!kit) throw notFound('That kit');
    if (input.name && input.name !== kit.name && (await trx('kits').where({ firm_id: actor.firmId, name: input.name }).first('id'))) {
      throw conflict(`There is already a kit called "${input.name}".`);
    }
    const patch = { ...(input.name !== undefined && { name: input.name }), ...(input.notes !== undefined && { notes: input.notes }) };
    if (Object.keys(patch).length) await trx('kits').where({ firm_id: actor.firmId, id }).update(patch);
  });
  return (await getKitDetail(deps, actor, id)).kit;
}
