import type { Knex } from 'knex';
import { defaultReminderSettings, type ReminderSettings, type ReminderSettingsView } from '@heatfleet/domain';

type Db = Knex | Knex.Transaction;

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
  const row = (await db('reminder_settings')
    .where({ firm_id: firmId })
    .first(
      'scan_hour',
      'inspection_reminders',
      'van_reminders',
      'stock_reminders',
      'annual_check_reminders',
      'annual_check_customer_emails',
      'last_scan_on',
    )) as SettingsRow | undefined;
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
    ...(settings.annualCheckCustomerEmails === undefined
      ? {}
      : { annual_check_customer_emails: settings.annualCheckCustomerEmails }),
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
    { id: number; name: string; time_zone: string } | undefined;
  if (!firm) return undefined;
  const row = (await trx('reminder_settings')
    .where({ firm_id: firmId })
    .forUpdate()
    .first(
      'scan_hour',
      'inspection_reminders',
      'van_reminders',
      'stock_reminders',
      'annual_check_reminders',
      'annual_check_customer_emails',
      'last_scan_on',
    )) as SettingsRow | undefined;
  return { id: firm.id, name: firm.name, timeZone: firm.time_zone, settings: toSettings(row) };
}

export async function markFirmScanned(trx: Knex.Transaction, firmId: number, on: string): Promise<void> {
  await trx('reminder_settings').where({ firm_id: firmId }).update({ last_scan_on: on });
}

/** Every firm with its settings, for the hourly sweep to decide which are due a scan. */
export async function listFirmsToScan(db: Db, firmIds?: number[]): Promise<FirmToScan[]> {
  const q = db('firms as f')
    .leftJoin('reminder_settings as s', 's.firm_id', 'f.id')
    .select(
      'f.id',
      'f.name',
      'f.time_zone',
      's.scan_hour',
      's.inspection_reminders',
      's.van_reminders',
      's.stock_reminders',
      's.annual_check_reminders',
      's.annual_check_customer_emails',
      's.last_scan_on',
    )
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
