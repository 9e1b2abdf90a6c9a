import type { Knex } from 'knex';
import type { ResultSetHeader } from 'mysql2';
import {
  defaultReminderSettings,
  type CalendarDate,
  type ReminderDelivery,
  type ReminderKind,
  type ReminderSettings,
  type ReminderSettingsView,
  type ReminderSubjectType,
} from '@heatfleet/domain';

type Db = Knex | Knex.Transaction;

export type { ReminderKind };

export interface FirmToScan {
  id: number;
  name: string;
  timeZone: string;
  settings: ReminderSettingsView;
}

interface SettingsRow {
  scan_hour: number;
  inspection_reminders: number | boolean;
  van_reminders: number | boolean;
  stock_reminders: number | boolean;
  annual_check_reminders: number | boolean;
  annual_check_customer_emails: number | boolean;
  last_scan_on: string | null;
}

const toSettings = (row: SettingsRow | undefined): ReminderSettingsView =>
  row
    ? {
        scanHour: Number(row.scan_hour),
        inspectionReminders: Boolean(row.inspection_reminders),
        vanReminders: Boolean(row.van_reminders),
        stockReminders: Boolean(row.stock_reminders),
        annualCheckReminders: Boolean(row.annual_check_reminders),
        annualCheckCustomerEmails: Boolean(row.annual_check_customer_emails),
        lastScanOn: row.last_scan_on,
      }
    : { ...defaultReminderSettings, lastScanOn: null };

export async function findReminderSettings(db: Db, firmId: number): Promise<ReminderSettingsView> {
  const row = (await db('reminder_settings').where({ firm_id: firmId }).first('scan_hour', 'inspection_reminders', 'van_reminders', 'stock_reminders', 'annual_check_reminders', 'annual_check_customer_emails', 'last_scan_on')) as
    | SettingsRow
    | undefined;
  return toSettings(row);
}

/**
 * Writes the settings, creating the row on first use (a firm without one has the defaults). A switch
 * left out of the input keeps its stored value (or the column default on a new row).
 */
export async function saveReminderSettings(db: Db, firmId: number, settings: ReminderSettings): Promise<void> {
  const stock = {
    ...(settings.stockReminders === undefined ? {} : { stock_reminders: settings.stockReminders }),
    ...(settings.annualCheckReminders === undefined ? {} : { annual_check_reminders: settings.annualCheckReminders }),
    ...(settings.annualCheckCustomerEmails === undefined ? {} : { annual_check_customer_emails: settings.annualCheckCustomerEmails }),
  };
  await db('reminder_settings')
    .insert({
      firm_id: firmId,
      scan_hour: settings.scanHour,
      inspection_reminders: settings.inspectionReminders,
      van_reminders: settings.vanReminders,
      ...stock,
      updated_at: db.fn.now(3),
    })
    .onConflict('firm_id')
    .merge(['scan_hour', 'inspection_reminders', 'van_reminders', ...Object.keys(stock), 'updated_at']);
}

/**
 * Gives the firm its settings row (the defaults) if it has none. Run on its own, outside the scan's
 * transaction: concurrent INSERT IGNOREs of one new key inside transactions that then lock the row
 * deadlock each other in InnoDB.
 */
export async function ensureReminderSettingsRow(db: Knex, firmId: number): Promise<void> {
  await db.raw('INSERT IGNORE INTO reminder_settings (firm_id) SELECT id FROM firms WHERE id = ?', [firmId]);
}

/**
 * Locks the firm's settings row for the transaction, so two scans of one firm (a duplicated job,
 * the button and the scheduler) run one after the other, never interleaved.
 */
export async function lockFirmForScan(trx: Knex.Transaction, firmId: number): Promise<FirmToScan | undefined> {
  const firm = (await trx('firms').where({ id: firmId }).first('id', 'name', 'time_zone')) as
    | { id: number; name: string; time_zone: string }
    | undefined;
  if (!firm) return undefined;
  const row = (await trx('reminder_settings')
    .where({ firm_id: firmId })
    .forUpdate()
    .first('scan_hour', 'inspection_reminders', 'van_reminders', 'stock_reminders', 'annual_check_reminders', 'annual_check_customer_emails', 'last_scan_on')) as SettingsRow | undefined;
  return { id: firm.id, name: firm.name, timeZone: firm.time_zone, settings: toSettings(row) };
}

export async function markFirmScanned(trx: Knex.Transaction, firmId: number, on: string): Promise<void> {
  await trx('reminder_settings').where({ firm_id: firmId }).update({ last_scan_on: on });
}

/** Every firm with its settings, for the hourly sweep to decide which are due a scan. */
export async function listFirmsToScan(db: Db, firmIds?: number[]): Promise<FirmToScan[]> {
  const q = db('firms as f')
    .leftJoin('reminder_settings as s', 's.firm_id', 'f.id')
    .select('f.id', 'f.name', 'f.time_zone', 's.scan_hour', 's.inspection_reminders', 's.van_reminders', 's.stock_reminders', 's.annual_check_reminders', 's.annual_check_customer_emails', 's.last_scan_on')
    .orderBy('f.id');
  if (firmIds) q.whereIn('f.id', firmIds);
  const rows = (await q) as (SettingsRow & { id: number; name: string; time_zone: string; scan_hour: number | null })[];
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    timeZone: r.time_zone,
    settings: toSettings(r.scan_hour === null ? undefined : r),
  }));
}

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
  const inspectionsOf = () => db('inspections as ins').whereRaw('ins.firm_id = i.firm_id').whereRaw('ins.item_id = i.id');
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
      db('custody_events as e')
        .whereRaw('e.firm_id = i.firm_id')
        .whereRaw('e.item_id = i.id')
        .where('e.action', 'check_in')
        .whereRaw("e.created_at > COALESCE((?), '1970-01-01')", [inspectionsOf().max('ins.created_at')])
        .count('*')
        .as('uses_since_inspection'),
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

export interface StockPlace {
  id: number;
  kind: 'van' | 'depot';
  name: string;
  registration: string | null;
  engineerMemberId: number | null;
}

/** The firm's active vans and depots, depots first (the first depot is the one the restock run draws on). */
export async function listStockPlaces(db: Db, firmId: number): Promise<StockPlace[]> {
  const rows = (await db('locations')
    .where({ firm_id: firmId, active: true })
    .whereIn('kind', ['van', 'depot'])
    .select('id', 'kind', 'name', 'registration', 'engineer_member_id')
    .orderBy([{ column: 'kind' }, { column: 'id' }])) as {
    id: number;
    kind: 'van' | 'depot';
    name: string;
    registration: string | null;
    engineer_member_id: number | null;
  }[];
  return rows.map((r) => ({ id: r.id, kind: r.kind, name: r.name, registration: r.registration, engineerMemberId: r.engineer_member_id }));
}

export async function listActiveProducts(db: Db, firmId: number): Promise<{ id: number; name: string }[]> {
  return (await db('products').where({ firm_id: firmId, active: true }).select('id', 'name').orderBy('name')) as { id: number; name: string }[];
}

/** The newest movement that added stock of a product at a place (received, transferred in, counted up, reversed back), if any. */
export async function latestArrivalId(db: Db, firmId: number, locationId: number, productId: number): Promise<number | null> {
  const row = (await db('stock_movements')
    .where({ firm_id: firmId, location_id: locationId, product_id: productId })
    .where('quantity_delta', '>', 0)
    .orderBy('id', 'desc')
    .first('id')) as { id: number | string } | undefined;
  return row ? Number(row.id) : null;
}

/** Packs used per product across the firm since an instant (the reorder list's 90 days). */
export async function packsUsedSince(db: Db, firmId: number, since: Date): Promise<Map<number, number>> {
  const rows = (await db('stock_movements')
    .where({ firm_id: firmId, kind: 'used' })
    .where('created_at', '>=', since)
    .groupBy('product_id')
    .select('product_id')
    .sum({ n: 'quantity_delta' })) as { product_id: number; n: string | number }[];
  return new Map(rows.map((r) => [r.product_id, -Number(r.n)]));
}

export interface BatchHeld {
  batchId: number;
  lotNumber: string;
  expiresOn: CalendarDate;
  productName: string;
  /** Packs per place holding it, largest first. */
  places: { name: string; quantity: number }[];
}

/** Batches of active products with stock somewhere that expire on or before `lastDay` (already expired included). */
export async function listBatchesHeldExpiringBy(db: Db, firmId: number, lastDay: CalendarDate): Promise<BatchHeld[]> {
  const rows = (await db('stock_balances as s')
    .join('product_batches as b', (j) => j.on('b.id', '=', 's.batch_id').andOn('b.firm_id', '=', 's.firm_id'))
    .join('products as p', (j) => j.on('p.id', '=', 's.product_id').andOn('p.firm_id', '=', 's.firm_id'))
    .join('locations as l', (j) => j.on('l.id', '=', 's.location_id').andOn('l.firm_id', '=', 's.firm_id'))
    .where('s.firm_id', firmId)
    .where('s.quantity', '>', 0)
    .where('b.expires_on', '<=', lastDay)
    .where('p.active', true)
    .select('b.id as batch_id', 'b.lot_number', 'b.expires_on', 'p.name as product_name', 'l.name as location_name', 's.quantity')
    .orderBy([{ column: 'b.expires_on' }, { column: 'p.name' }, { column: 'b.lot_number' }, { column: 's.quantity', order: 'desc' }, { column: 'l.name' }])) as {
    batch_id: number;
    lot_number: string;
    expires_on: string;
    product_name: string;
    location_name: string;
    quantity: number;
  }[];
  const byBatch = new Map<number, BatchHeld>();
  for (const r of rows) {
    const batch = byBatch.get(r.batch_id) ?? { batchId: r.batch_id, lotNumber: r.lot_number, expiresOn: r.expires_on, productName: r.product_name, places: [] };
    batch.places.push({ name: r.location_name, quantity: r.quantity });
    byBatch.set(r.batch_id, batch);
  }
  return [...byBatch.values()];
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

export interface NewReminder {
  kind: ReminderKind;
  subjectType: ReminderSubjectType;
  subjectId: number;
  periodKey: string;
  summary: string;
}

/**
 * INSERT IGNORE against the unique (firm, kind, subject, period) key: the id when this call made the
 * row, undefined when the thing was already reminded for that period (by an earlier or a racing scan,
 * which holds the key's lock until it commits).
 */
export async function insertReminderIfNew(trx: Knex.Transaction, firmId: number, reminder: NewReminder): Promise<number | undefined> {
  const [result] = (await trx.raw(
    'INSERT IGNORE INTO reminders (firm_id, kind, subject_type, subject_id, period_key, summary) VALUES (?, ?, ?, ?, ?, ?)',
    [firmId, reminder.kind, reminder.subjectType, reminder.subjectId, reminder.periodKey, reminder.summary.slice(0, 300)],
  )) as [ResultSetHeader];
  return result.affectedRows === 1 ? result.insertId : undefined;
}

export async function insertReminderDeliveries(
  trx: Knex.Transaction,
  firmId: number,
  rows: { reminderId: number; emailId: number; recipient: string }[],
): Promise<void> {
  if (rows.length === 0) return;
  await trx('reminder_deliveries').insert(
    rows.map((r) => ({ firm_id: firmId, reminder_id: r.reminderId, email_id: r.emailId, recipient: r.recipient })),
  );
}

/** What was sent, to whom and why, newest first. */
export async function listReminderDeliveries(db: Db, firmId: number, limit: number): Promise<ReminderDelivery[]> {
  const rows = (await db('reminder_deliveries as d')
    .join('reminders as r', function joinReminder() {
      this.on('r.id', '=', 'd.reminder_id').andOn('r.firm_id', '=', 'd.firm_id');
    })
    .leftJoin('emails as e', function joinEmail() {
      this.on('e.id', '=', 'd.email_id').andOn('e.firm_id', '=', 'd.firm_id');
    })
    .where('d.firm_id', firmId)
    .select('d.id', 'r.kind', 'r.subject_type', 'r.subject_id', 'r.summary', 'd.recipient', 'e.sent_at', 'd.created_at')
    .orderBy([
      { column: 'd.created_at', order: 'desc' },
      { column: 'd.id', order: 'desc' },
    ])
    .limit(limit)) as {
    id: number;
    kind: ReminderKind;
    subject_type: ReminderSubjectType;
    subject_id: number;
    summary: string;
    recipient: string;
    sent_at: Date | null;
    created_at: Date;
  }[];
  return rows.map((r) => ({
    id: Number(r.id),
    kind: r.kind,
    subjectType: r.subject_type,
    subjectId: r.subject_id,
    summary: r.summary,
    recipient: r.recipient,
    sentAt: r.sent_at ? new Date(r.sent_at).toISOString() : null,
    createdAt: new Date(r.created_at).toISOString(),
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
    .select('s.id', 's.address', 'c.name as customer_name', 'c.email as customer_email', 's.next_check_on')) as { id: number; address: string; customer_name: string; customer_email: string | null; next_check_on: string }[];
  return rows.map((r) => ({ id: r.id, address: r.address, customerName: r.customer_name, customerEmail: r.customer_email, nextCheckOn: r.next_check_on }));
}
