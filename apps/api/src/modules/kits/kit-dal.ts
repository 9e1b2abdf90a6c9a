import type { Knex } from 'knex';
import type { CustodyEvent, Inspection, ItemCondition } from '@heatfleet/domain';
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
 * Items with their kind's rule, kit, location and the inputs of the due computation (last
 * inspection day; check-ins since the last inspection was recorded), in one query.
 */
export function selectItems(db: Db, firmId: number, filter: ItemFilter = {}) {
  const lastInspection = db('inspections as ins').whereRaw('ins.firm_id = i.firm_id').whereRaw('ins.item_id = i.id');
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
      lastInspection.clone().max('ins.inspected_on').as('last_inspected_on'),
      db('custody_events as e')
        .whereRaw('e.firm_id = i.firm_id')
        .whereRaw('e.item_id = i.id')
        .where('e.action', 'check_in')
        .whereRaw("e.created_at > COALESCE((?), '1970-01-01')", [lastInspection.clone().max('ins.created_at')])
        .count('*')
        .as('uses_since_inspection'),
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
    q.where((w) => w.where('i.asset_tag', 'like', pattern).orWhere('i.serial_number', 'like', pattern).orWhere('k.name', 'like', pattern));
  }
  return q as unknown as Promise<ItemRow[]>;
}

export function locationRefOf(row: ItemRow) {
  return row.location_id && row.loc_kind && row.loc_name
    ? toLocationRef({ id: row.location_id, kind: row.loc_kind, name: row.loc_name, registration: row.loc_registration, engineer_name: row.loc_engineer_name })
    : null;
}

/** Locks the rows in id order, so two requests over overlapping items cannot deadlock each other. */
export async function lockItems(trx: Knex.Transaction, firmId: number, where: { kitId?: number; itemId?: number }): Promise<number[]> {
  const q = trx('kit_items').where('firm_id', firmId).orderBy('id').forUpdate().select('id');
  if (where.kitId !== undefined) q.where('kit_id', where.kitId);
  if (where.itemId !== undefined) q.where('id', where.itemId);
  return ((await q) as { id: number }[]).map((r) => r.id);
}

export async function insertCustodyEvents(
  trx: Knex.Transaction,
  rows: {
    firm_id: number;
    item_id: number;
    kit_id: number | null;
    action: 'check_out' | 'check_in' | 'move';
    from_location_id: number | null;
    to_location_id: number | null;
    by_user_id: number;
    condition: ItemCondition | null;
    missing_parts: string | null;
    note: string | null;
    overdue_reason: string | null;
    photo_id: number | null;
    created_at: Date;
  }[],
): Promise<void> {
  if (rows.length) await trx('custody_events').insert(rows);
}

export async function listCustodyEvents(db: Db, firmId: number, where: { kitId?: number; itemId?: number }, limit = 100): Promise<CustodyEvent[]> {
  const q = db('custody_events as e')
    .join('kit_items as i', function joinItem() {
      this.on('i.id', '=', 'e.item_id').andOn('i.firm_id', '=', 'e.firm_id');
    })
    .join('users as u', 'u.id', 'e.by_user_id')
    .leftJoin('locations as lf', function joinFrom() {
      this.on('lf.id', '=', 'e.from_location_id').andOn('lf.firm_id', '=', 'e.firm_id');
    })
    .leftJoin('locations as lt', function joinTo() {
      this.on('lt.id', '=', 'e.to_location_id').andOn('lt.firm_id', '=', 'e.firm_id');
    })
    .where('e.firm_id', firmId)
    .orderBy('e.id', 'desc')
    .limit(limit)
    .select(
      'e.*',
      'i.asset_tag',
      'u.name as by_name',
      'lf.kind as f_kind', 'lf.name as f_name', 'lf.registration as f_reg',
      'lt.kind as t_kind', 'lt.name as t_name', 'lt.registration as t_reg',
    );
  if (where.kitId !== undefined) q.where('e.kit_id', where.kitId);
  if (where.itemId !== undefined) q.where('e.item_id', where.itemId);
  const rows = (await q) as Record<string, never>[];
  const ref = (id: number | null, kind: 'depot' | 'van' | null, name: string | null, registration: string | null) =>
    id && kind && name ? { id, kind, name, registration, engineerName: null } : null;
  return rows.map((r: Record<string, unknown>) => ({
    id: Number(r.id),
    action: r.action as CustodyEvent['action'],
    item: { id: r.item_id as number, assetTag: r.asset_tag as string },
    kitId: (r.kit_id as number | null) ?? null,
    from: ref(r.from_location_id as number | null, r.f_kind as 'van' | null, r.f_name as string | null, r.f_reg as string | null),
    to: ref(r.to_location_id as number | null, r.t_kind as 'van' | null, r.t_name as string | null, r.t_reg as string | null),
    byName: r.by_name as string,
    condition: (r.condition as ItemCondition | null) ?? null,
    missingParts: (r.missing_parts as string | null) ?? null,
    note: (r.note as string | null) ?? null,
    overdueReason: (r.overdue_reason as string | null) ?? null,
    photoId: (r.photo_id as number | null) ?? null,
    createdAt: (r.created_at as Date).toISOString(),
  }));
}

export async function listInspections(db: Db, firmId: number, itemIds: number[]): Promise<Inspection[]> {
  if (itemIds.length === 0) return [];
  const rows = (await db('inspections as ins')
    .join('users as u', 'u.id', 'ins.by_user_id')
    .where('ins.firm_id', firmId)
    .whereIn('ins.item_id', itemIds)
    .orderBy('ins.id', 'desc')
    .limit(200)
    .select('ins.*', 'u.name as by_name')) as Record<string, unknown>[];
  return rows.map((r) => ({
    id: r.id as number,
    itemId: r.item_id as number,
    result: r.result as Inspection['result'],
    notes: (r.notes as string | null) ?? null,
    photoId: (r.photo_id as number | null) ?? null,
    byName: r.by_name as string,
    inspectedOn: r.inspected_on as string,
    createdAt: (r.created_at as Date).toISOString(),
  }));
}
