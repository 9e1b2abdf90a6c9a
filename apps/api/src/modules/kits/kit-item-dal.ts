import type { Knex } from 'knex';
import type { ItemCondition } from '@heatfleet/domain';
import { toLocationRef } from '../locations/location-dal.ts';

type Db = Knex | Knex.Transaction;

export interface ItemRow {
  id: number;
  firm_id: number;
  kit_id: number | null;
  kind_id: number;
  asset_tag: string;
  serial_number: string | null;
  condition: ItemCondition;
  notes: string | null;
  location_id: number | null;
  in_service_since: string;
  vibration_ms2: string | null;
  kind_name: string;
  interval_days: number | null;
  interval_uses: number | null;
  due_soon_days: number;
  overdue_policy: 'allow_with_reason' | 'block';
  kit_name: string | null;
  loc_kind: 'depot' | 'van' | null;
  loc_name: string | null;
  loc_registration: string | null;
  loc_engineer_member_id: number | null;
  loc_engineer_name: string | null;
  last_inspected_on: string | null;
  uses_since_inspection: number;
}

export interface ItemFilter {
  ids?: number[];
  kitId?: number;
  /** Only items that belong to a kit (the kits list needs no loose items). */
  inKit?: boolean;
  kindId?: number;
  locationId?: number;
  q?: string;
}

/**
 * Items with their kind's rule, kit, location and the inputs of the due computation, in one query. The last
 * inspection day and the uses since it are columns of the item, kept by the database with every inspection,
 * check-in and job use (migrations/20261203230810_keep-kit-item-inspection-state.ts), so this is a plain read.
 */
export function selectItems(db: Db, firmId: number, filter: ItemFilter = {}) {
  const q = db('kit_items as i')
    .join('item_kinds as ik', function joinKind() {
      this.on('ik.id', '=', 'i.kind_id').andOn('ik.firm_id', '=', 'i.firm_id');
    })
    .leftJoin('kits as k', function joinKit() {
      this.on('k.id', '=', 'i.kit_id').andOn('k.firm_id', '=', 'i.firm_id');
    })
    .leftJoin('locations as l', function joinLocation() {
      this.on('l.id', '=', 'i.location_id').andOn('l.firm_id', '=', 'i.firm_id');
    })
    // By primary key: with the firm known, MariaDB otherwise scans the firm's memberships once per item.
    .leftJoin(db.raw('?? FORCE INDEX (PRIMARY)', ['memberships as m']), function joinEngineer() {
      this.on('m.id', '=', 'l.engineer_member_id').andOn('m.firm_id', '=', 'i.firm_id');
    })
    .leftJoin('users as u', 'u.id', 'm.user_id')
    .where('i.firm_id', firmId)
    .select(
      'i.*',
      'ik.name as kind_name',
      'ik.interval_days',
      'ik.interval_uses',
      'ik.due_soon_days',
      'ik.overdue_policy',
      'k.name as kit_name',
      'l.kind as loc_kind',
      'l.name as loc_name',
      'l.registration as loc_registration',
      'l.engineer_member_id as loc_engineer_member_id',
      'u.name as loc_engineer_name',
    )
    .orderBy('i.asset_tag');
  if (filter.ids) q.whereIn('i.id', filter.ids);
  if (filter.kitId !== undefined) q.where('i.kit_id', filter.kitId);
  if (filter.inKit) q.whereNotNull('i.kit_id');
  if (filter.kindId !== undefined) q.where('i.kind_id', filter.kindId);
  if (filter.locationId !== undefined) q.where('i.location_id', filter.locationId);
  if (filter.q) {
    // Plain LIKE: the column's collation already ignores case (knex's whereLike adds a binary
    // collation MariaDB refuses for utf8mb4). Wildcards typed by the user are taken literally.
    const pattern = `%${filter.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    q.where((w) =>
      w
        .where('i.asset_tag', 'like', pattern)
        .orWhere('i.serial_number', 'like', pattern)
        .orWhere('k.name', 'like', pattern),
    );
  }
  return q as unknown as Promise<ItemRow[]>;
}

// The sorts that are columns; the due sort and the inspection-state filter need each item's computed due state.
const sortColumns = { assetTag: 'i.asset_tag', kind: 'ik.name', kit: 'k.name', location: 'l.name' } as const;
export type ItemSortColumn = keyof typeof sortColumns;

/** One page of items in SQL (LIMIT/OFFSET over the firm's indexed rows), ties by asset tag, and the total. */
export async function selectItemPage(
  db: Db,
  firmId: number,
  filter: ItemFilter,
  page: { sort: ItemSortColumn; dir: 'asc' | 'desc'; limit: number; offset: number },
): Promise<{ rows: ItemRow[]; total: number }> {
  const base = selectItems(db, firmId, filter) as unknown as Knex.QueryBuilder;
  const rowsQuery = base.clone().clearOrder();
  if (page.sort !== 'assetTag') rowsQuery.orderBy(sortColumns[page.sort], page.dir);
  rowsQuery
    .orderBy('i.asset_tag', page.sort === 'assetTag' ? page.dir : 'asc')
    .limit(page.limit)
    .offset(page.offset);
  const [rows, counted] = await Promise.all([
    rowsQuery as unknown as Promise<ItemRow[]>,
    base.clone().clearSelect().clearOrder().count({ n: '*' }) as unknown as Promise<{ n: number | string }[]>,
  ]);
  return { rows, total: Number(counted[0]?.n ?? 0) };
}

export function locationRefOf(row: ItemRow) {
  return row.location_id && row.loc_kind && row.loc_name
    ? toLocationRef({
        id: row.location_id,
        kind: row.loc_kind,
        name: row.loc_name,
        registration: row.loc_registration,
        engineer_name: row.loc_engineer_name,
      })
    : null;
}

/** Locks the rows in id order, so two requests over overlapping items cannot deadlock each other. */
export async function lockItems(
  trx: Knex.Transaction,
  firmId: number,
  where: { kitId?: number; itemId?: number },
): Promise<number[]> {
  const q = trx('kit_items').where('firm_id', firmId).orderBy('id').forUpdate().select('id');
  if (where.kitId !== undefined) q.where('kit_id', where.kitId);
  if (where.itemId !== undefined) q.where('id', where.itemId);
  return ((await q) as { id: number }[]).map((r) => r.id);
}

export async function findItemId(
  db: Db,
  firmId: number,
  id: number,
  opts: { forUpdate?: boolean } = {},
): Promise<number | undefined> {
  const q = db('kit_items').where({ firm_id: firmId, id }).first('id');
  if (opts.forUpdate) q.forUpdate();
  const row = (await q) as { id: number } | undefined;
  return row?.id;
}

/** An item's kind, locking the item row when asked (an inspection's rules depend on the kind). */
export async function findItemKindId(
  db: Db,
  firmId: number,
  id: number,
  opts: { forUpdate?: boolean } = {},
): Promise<number | undefined> {
  const q = db('kit_items').where({ firm_id: firmId, id }).first('kind_id');
  if (opts.forUpdate) q.forUpdate();
  const row = (await q) as { kind_id: number } | undefined;
  return row?.kind_id;
}

export async function assetTagTaken(db: Db, firmId: number, assetTag: string): Promise<boolean> {
  return Boolean(await db('kit_items').where({ firm_id: firmId, asset_tag: assetTag }).first('id'));
}

export interface NewItemRow {
  kit_id: number | null;
  kind_id: number;
  asset_tag: string;
  serial_number: string | null;
  notes: string | null;
  location_id: number | null;
  in_service_since: string;
}

export async function insertItem(trx: Knex.Transaction, firmId: number, row: NewItemRow): Promise<number> {
  const [id] = await trx('kit_items').insert({ firm_id: firmId, ...row });
  return id as number;
}

export type ItemPatch = Partial<{
  kind_id: number;
  kit_id: number | null;
  serial_number: string | null;
  notes: string | null;
  condition: ItemCondition;
  vibration_ms2: number | null;
  location_id: number;
}>;

export async function updateItems(
  trx: Knex.Transaction,
  firmId: number,
  ids: number[],
  patch: ItemPatch,
): Promise<void> {
  if (ids.length === 0 || Object.keys(patch).length === 0) return;
  await trx('kit_items').where('firm_id', firmId).whereIn('id', ids).update(patch);
}
