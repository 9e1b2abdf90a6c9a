import type { Knex } from 'knex';
import type { Depot, LocationRef, Van } from '@heatfleet/domain';

export interface LocationRow {
  id: number;
  firm_id: number;
  kind: 'depot' | 'van';
  name: string;
  registration: string | null;
  engineer_member_id: number | null;
  mot_due_on: string | null;
  service_due_on: string | null;
  notes: string | null;
  active: number;
  engineer_name: string | null;
}

type Db = Knex | Knex.Transaction;

function locations(db: Db, firmId: number) {
  return db('locations as l')
    .leftJoin('memberships as m', function joinEngineer() {
      this.on('m.id', '=', 'l.engineer_member_id').andOn('m.firm_id', '=', 'l.firm_id');
    })
    .leftJoin('users as u', 'u.id', 'm.user_id')
    .where('l.firm_id', firmId)
    .select('l.*', 'u.name as engineer_name');
}

export function toLocationRef(
  row: Pick<LocationRow, 'id' | 'kind' | 'name' | 'registration' | 'engineer_name'>,
): LocationRef {
  return {
    id: row.id,
    kind: row.kind,
    name: row.name,
    registration: row.registration,
    engineerName: row.engineer_name,
  };
}

export async function listLocations(db: Db, firmId: number, kind?: 'depot' | 'van'): Promise<LocationRow[]> {
  const q = locations(db, firmId).orderBy('l.name');
  if (kind) q.where('l.kind', kind);
  return q;
}

export async function findLocation(
  db: Db,
  firmId: number,
  id: number,
  opts: { forUpdate?: boolean } = {},
): Promise<LocationRow | undefined> {
  const q = locations(db, firmId).where('l.id', id).first();
  if (opts.forUpdate) q.forUpdate();
  return q;
}

export async function findVanOfMember(db: Db, firmId: number, memberId: number): Promise<LocationRow | undefined> {
  return locations(db, firmId)
    .where({ 'l.kind': 'van', 'l.engineer_member_id': memberId, 'l.active': true })
    .orderBy('l.id')
    .first();
}

export async function firstDepot(db: Db, firmId: number): Promise<LocationRow | undefined> {
  return locations(db, firmId).where('l.kind', 'depot').where('l.active', true).orderBy('l.id').first();
}

/** Another van or depot of the firm with this registration, if any. */
export async function findLocationByRegistration(
  db: Db,
  firmId: number,
  registration: string,
  exceptId?: number,
): Promise<{ id: number; name: string } | undefined> {
  const q = db('locations').where({ firm_id: firmId, registration }).first('id', 'name');
  if (exceptId) q.whereNot('id', exceptId);
  return (await q) as { id: number; name: string } | undefined;
}

/** Whether another van or depot of the firm has this name. */
export async function locationNameTaken(db: Db, firmId: number, name: string, exceptId?: number): Promise<boolean> {
  const q = db('locations').where({ firm_id: firmId, name }).first('id');
  if (exceptId) q.whereNot('id', exceptId);
  return Boolean(await q);
}

export async function insertLocation(
  trx: Knex.Transaction,
  firmId: number,
  row: Partial<Omit<LocationRow, 'id' | 'firm_id' | 'engineer_name'>>,
): Promise<number> {
  const [id] = await trx('locations').insert({ ...row, firm_id: firmId });
  return id as number;
}

export async function updateLocation(
  trx: Knex.Transaction,
  firmId: number,
  id: number,
  patch: Partial<Omit<LocationRow, 'id' | 'firm_id' | 'engineer_name'>>,
): Promise<void> {
  if (Object.keys(patch).length === 0) return;
  await trx('locations').where({ firm_id: firmId, id }).update(patch);
}

/** Kits with at least one item at each location, and item counts, in two queries for all locations. */
export async function contentsByLocation(db: Db, firmId: number, locationIds: number[]) {
  if (locationIds.length === 0) return new Map<number, { kits: { id: number; name: string }[]; items: number }>();
  const [kitRows, itemRows] = await Promise.all([
    db('kit_items as i')
      .join('kits as k', function joinKit() {
        this.on('k.id', '=', 'i.kit_id').andOn('k.firm_id', '=', 'i.firm_id');
      })
      .where('i.firm_id', firmId)
      .whereIn('i.location_id', locationIds)
      .distinct('i.location_id', 'k.id', 'k.name')
      .orderBy('k.name') as Promise<{ location_id: number; id: number; name: string }[]>,
    db('kit_items')
      .where('firm_id', firmId)
      .whereIn('location_id', locationIds)
      .groupBy('location_id')
      .select('location_id')
      .count({ n: '*' }) as Promise<{ location_id: number; n: number }[]>,
  ]);
  const out = new Map<number, { kits: { id: number; name: string }[]; items: number }>();
  for (const id of locationIds) out.set(id, { kits: [], items: 0 });
  for (const k of kitRows) out.get(k.location_id)!.kits.push({ id: k.id, name: k.name });
  for (const r of itemRows) out.get(r.location_id)!.items = Number(r.n);
  return out;
}

export function toVan(
  row: LocationRow,
  contents: { kits: { id: number; name: string }[]; items: number } | undefined,
): Van {
  const dates = [
    row.mot_due_on ? { what: 'MOT' as const, on: row.mot_due_on } : null,
    row.service_due_on ? { what: 'service' as const, on: row.service_due_on } : null,
  ].filter((d): d is { what: 'MOT' | 'service'; on: string } => d !== null);
  dates.sort((a, b) => a.on.localeCompare(b.on));
  return {
    id: row.id,
    kind: 'van',
    name: row.name,
    registration: row.registration ?? '',
    engineer:
      row.engineer_member_id && row.engineer_name
        ? { memberId: row.engineer_member_id, name: row.engineer_name }
        : null,
    motDueOn: row.mot_due_on,
    serviceDueOn: row.service_due_on,
    notes: row.notes,
    active: Boolean(row.active),
    kitsOnBoard: contents?.kits ?? [],
    itemsOnBoard: contents?.items ?? 0,
    nextDue: dates[0] ?? null,
  };
}

export function toDepot(row: LocationRow): Depot {
  return { id: row.id, kind: 'depot', name: row.name, notes: row.notes };
}
