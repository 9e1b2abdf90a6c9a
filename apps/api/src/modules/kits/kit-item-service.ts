import { ForbiddenError } from '@casl/ability';
import {
  inspectionDue,
  type CreateKitItemInput,
  type KitItem,
  type KitItemDetailResponse,
  type KitItemListQuery,
  type KitItemPageResponse,
  type UpdateKitItemInput,
} from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { conflict, notFound } from '../../lib/http-error.ts';
import { firmToday } from '../firms/firm-today.ts';
import { findItemKind } from '../item-kinds/item-kind-dal.ts';
import { findLocation, firstDepot } from '../locations/location-dal.ts';
import { listItemPhotos } from '../photos/photo-dal.ts';
import { listCustodyEvents } from './custody-dal.ts';
import { listInspections } from './inspection-dal.ts';
import { findKit } from './kit-dal.ts';
import {
  assetTagTaken,
  findItemId,
  insertItem,
  locationRefOf,
  selectItemPage,
  selectItems,
  updateItems,
  type ItemFilter,
  type ItemRow,
} from './kit-item-dal.ts';

type Db = Knex | Knex.Transaction;
export const inspectionStateRank = { no_rule: 0, ok: 1, due_soon: 2, overdue: 3 } as const;

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

export async function listItems(deps: AppDeps, actor: Actor, query: KitItemListQuery): Promise<KitItemPageResponse> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'KitItem');
  if (!query.inspectionState && query.sort !== 'due') {
    // Sorted by a column: the page is read in SQL, each row a plain read (the item keeps its inspection inputs).
    const [{ rows, total }, today] = await Promise.all([
      selectItemPage(deps.db, actor.firmId, query, {
        sort: query.sort,
        dir: query.dir,
        limit: query.pageSize,
        offset: (query.page - 1) * query.pageSize,
      }),
      firmToday(deps.db, actor.firmId, deps.clock.now()),
    ]);
    return { items: rows.map((r) => toKitItem(r, today)), total, page: query.page, pageSize: query.pageSize };
  }
  const all = await loadItems(deps.db, actor.firmId, deps.clock.now(), query);
  // The due state is computed from the day, not stored, so that filter and sort page here.
  const filtered = query.inspectionState ? all.filter((i) => i.inspection.state === query.inspectionState) : all;
  const key: Record<KitItemListQuery['sort'], (i: KitItem) => string | number> = {
    assetTag: (i) => i.assetTag,
    kind: (i) => i.kind.name,
    kit: (i) => i.kit?.name ?? '',
    location: (i) => i.location?.name ?? '',
    // Most urgent first when ascending: overdue, then due soon, then by due day.
    due: (i) => `${3 - inspectionStateRank[i.inspection.state]}:${i.inspection.dueOn ?? '9999-12-31'}`,
  };
  const by = key[query.sort];
  const sign = query.dir === 'desc' ? -1 : 1;
  filtered.sort((a, b) => {
    const x = by(a);
    const y = by(b);
    return sign * (x < y ? -1 : x > y ? 1 : 0) || a.assetTag.localeCompare(b.assetTag);
  });
  const start = (query.page - 1) * query.pageSize;
  return {
    items: filtered.slice(start, start + query.pageSize),
    total: filtered.length,
    page: query.page,
    pageSize: query.pageSize,
  };
}

export async function getItem(deps: AppDeps, actor: Actor, id: number, db: Db = deps.db): Promise<KitItem> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'KitItem');
  const [item] = await loadItems(db, actor.firmId, deps.clock.now(), { ids: [id] });
  if (!item) throw notFound('That item');
  return item;
}

export async function getItemDetail(deps: AppDeps, actor: Actor, id: number): Promise<KitItemDetailResponse> {
  const item = await getItem(deps, actor, id);
  const [events, inspections, photos] = await Promise.all([
    listCustodyEvents(deps.db, actor.firmId, { itemId: id }),
    listInspections(deps.db, actor.firmId, [id]),
    listItemPhotos(deps.db, actor.firmId, id),
  ]);
  return { item, events, inspections, photos };
}

async function checkKitExists(db: Db, firmId: number, kitId: number | null | undefined) {
  if (kitId === undefined || kitId === null) return;
  if (!(await findKit(db, firmId, kitId))) throw notFound('That kit');
}

export async function createItem(deps: AppDeps, actor: Actor, input: CreateKitItemInput): Promise<KitItem> {
  ForbiddenError.from(actor.ability).throwUnlessCan('create', 'KitItem');
  const today = await firmToday(deps.db, actor.firmId, deps.clock.now());
  const id = await deps.db.transaction(async (trx) => {
    if (!(await findItemKind(trx, actor.firmId, input.kindId))) throw notFound('That kind of item');
    await checkKitExists(trx, actor.firmId, input.kitId);
    const location = input.locationId
      ? await findLocation(trx, actor.firmId, input.locationId)
      : await firstDepot(trx, actor.firmId);
    if (input.locationId && !location) throw notFound('That location');
    if (await assetTagTaken(trx, actor.firmId, input.assetTag))
      throw conflict(`Asset tag ${input.assetTag} is already on another item.`);
    return insertItem(trx, actor.firmId, {
      kit_id: input.kitId ?? null,
      kind_id: input.kindId,
      asset_tag: input.assetTag,
      serial_number: input.serialNumber ?? null,
      notes: input.notes ?? null,
      location_id: location?.id ?? null,
      in_service_since: input.inServiceSince ?? today,
    });
  });
  return getItem(deps, actor, id);
}

export async function updateItem(deps: AppDeps, actor: Actor, id: number, input: UpdateKitItemInput): Promise<KitItem> {
  ForbiddenError.from(actor.ability).throwUnlessCan('update', 'KitItem');
  await deps.db.transaction(async (trx) => {
    if (!(await findItemId(trx, actor.firmId, id, { forUpdate: true }))) throw notFound('That item');
    if (input.kindId !== undefined && !(await findItemKind(trx, actor.firmId, input.kindId)))
      throw notFound('That kind of item');
    await checkKitExists(trx, actor.firmId, input.kitId);
    await updateItems(trx, actor.firmId, [id], {
      ...(input.kindId !== undefined && { kind_id: input.kindId }),
      ...(input.kitId !== undefined && { kit_id: input.kitId }),
      ...(input.serialNumber !== undefined && { serial_number: input.serialNumber }),
      ...(input.notes !== undefined && { notes: input.notes }),
      ...(input.condition !== undefined && { condition: input.condition }),
      ...(input.vibrationMs2 !== undefined && { vibration_ms2: input.vibrationMs2 }),
    });
  });
  return getItem(deps, actor, id);
}
