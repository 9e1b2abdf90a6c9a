import type { Knex } from 'knex';
import { usesSinceInspection } from '../kits/kit-use-dal.ts';

type Db = Knex | Knex.Transaction;

// What the scan reads about kit, vans, customers' sites and the people to tell.

export interface ItemForScan {
  id: number;
  assetTag: string;
  kindName: string;
  intervalDays: number | null;
  intervalUses: number | null;
  dueSoonDays: number;
  inServiceSince: string;
  lastInspectedOn: string | null;
  inspectionCount: number;
  usesSinceInspection: number;
  locationName: string | null;
  /** The engineer of the van the item is on, if it is on a van. */
  vanEngineerMemberId: number | null;
}

/**
 * Items whose kind has an inspection rule, with the due computation's inputs. Out-of-service items are
 * left out: they do not go out on jobs, so reminding anyone to inspect them is noise. Uses are the
 * check-ins recorded after the last inspection was, as the kit screens count them.
 */
export async function listItemsForScan(db: Db, firmId: number): Promise<ItemForScan[]> {
  const inspectionsOf = () =>
    db('inspections as ins').whereRaw('ins.firm_id = i.firm_id').whereRaw('ins.item_id = i.id');
  const rows = (await db('kit_items as i')
    .join('item_kinds as ik', function joinKind() {
      this.on('ik.id', '=', 'i.kind_id').andOn('ik.firm_id', '=', 'i.firm_id');
    })
    .leftJoin('locations as l', function joinLocation() {
      this.on('l.id', '=', 'i.location_id').andOn('l.firm_id', '=', 'i.firm_id');
    })
    .where('i.firm_id', firmId)
    .whereNot('i.condition', 'out_of_service')
    .andWhere((w) => w.whereNotNull('ik.interval_days').orWhereNotNull('ik.interval_uses'))
    .select(
      'i.id',
      'i.asset_tag',
      'i.in_service_since',
      'ik.name as kind_name',
      'ik.interval_days',
      'ik.interval_uses',
      'ik.due_soon_days',
      'l.name as location_name',
      'l.kind as location_kind',
      'l.engineer_member_id',
      inspectionsOf().max('ins.inspected_on').as('last_inspected_on'),
      inspectionsOf().count('*').as('inspection_count'),
      usesSinceInspection(db, inspectionsOf().max('ins.created_at')),
    )
    .orderBy('i.asset_tag')) as {
    id: number;
    asset_tag: string;
    in_service_since: string;
    kind_name: string;
    interval_days: number | null;
    interval_uses: number | null;
    due_soon_days: number;
    location_name: string | null;
    location_kind: 'van' | 'depot' | null;
    engineer_member_id: number | null;
    last_inspected_on: string | null;
    inspection_count: number | string;
    uses_since_inspection: number | string;
  }[];
  return rows.map((r) => ({
    id: r.id,
    assetTag: r.asset_tag,
    kindName: r.kind_name,
    intervalDays: r.interval_days,
    intervalUses: r.interval_uses,
    dueSoonDays: r.due_soon_days,
    inServiceSince: r.in_service_since,
    lastInspectedOn: r.last_inspected_on,
    inspectionCount: Number(r.inspection_count),
    usesSinceInspection: Number(r.uses_since_inspection),
    locationName: r.location_name,
    vanEngineerMemberId: r.location_kind === 'van' ? r.engineer_member_id : null,
  }));
}

export interface VanForScan {
  id: number;
  name: string;
  registration: string | null;
  engineerMemberId: number | null;
  motDueOn: string | null;
  serviceDueOn: string | null;
}

export async function listVansForScan(db: Db, firmId: number): Promise<VanForScan[]> {
  const rows = (await db('locations')
    .where({ firm_id: firmId, kind: 'van', active: true })
    .andWhere((w) => w.whereNotNull('mot_due_on').orWhereNotNull('service_due_on'))
    .select('id', 'name', 'registration', 'engineer_member_id', 'mot_due_on', 'service_due_on')
    .orderBy('name')) as {
    id: number;
    name: string;
    registration: string | null;
    engineer_member_id: number | null;
    mot_due_on: string | null;
    service_due_on: string | null;
  }[];
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    registration: r.registration,
    engineerMemberId: r.engineer_member_id,
    motDueOn: r.mot_due_on,
    serviceDueOn: r.service_due_on,
  }));
}

export interface SiteForScan {
  id: number;
  address: string;
  customerName: string;
  customerEmail: string | null;
  nextCheckOn: string;
}

/** Customers' sites with an annual check date, for the annual-check reminders. */
export async function listSitesForScan(trx: Knex.Transaction, firmId: number): Promise<SiteForScan[]> {
  const rows = (await trx('sites as s')
    .join('customers as c', (j) => j.on('c.id', '=', 's.customer_id').andOn('c.firm_id', '=', 's.firm_id'))
    .where('s.firm_id', firmId)
    .whereNotNull('s.next_check_on')
    .select('s.id', 's.address', 'c.name as customer_name', 'c.email as customer_email', 's.next_check_on')) as {
    id: number;
    address: string;
    customer_name: string;
    customer_email: string | null;
    next_check_on: string;
  }[];
  return rows.map((r) => ({
    id: r.id,
    address: r.address,
    customerName: r.customer_name,
    customerEmail: r.customer_email,
    nextCheckOn: r.next_check_on,
  }));
}

export interface Recipient {
  memberId: number;
  role: 'owner' | 'admin' | 'stores' | 'engineer';
  email: string;
  name: string;
}

export async function listActiveMembers(db: Db, firmId: number): Promise<Recipient[]> {
  const rows = (await db('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where({ 'm.firm_id': firmId, 'm.active': true })
    .select('m.id as member_id', 'm.role', 'u.email', 'u.name')
    .orderBy('m.id')) as { member_id: number; role: Recipient['role']; email: string; name: string }[];
  return rows.map((r) => ({ memberId: r.member_id, role: r.role, email: r.email, name: r.name }));
}
