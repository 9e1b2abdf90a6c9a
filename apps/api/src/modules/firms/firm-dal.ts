import type { Knex } from 'knex';
import {
  builtInHeatExchangerLitres,
  DEFAULT_COLD_BOTTOM_THRESHOLD_K,
  DEFAULT_TIME_ZONE,
  defaultItemKinds,
  heatExchangerDefaultsSchema,
  type FirmSettings,
  type FirmSettingsInput,
  type HeatExchangerDefaults,
} from '@heatfleet/domain';

export interface FirmRow {
  id: number;
  name: string;
  time_zone: string;
}

export async function insertFirm(trx: Knex.Transaction, firm: { name: string }): Promise<number> {
  const [id] = await trx('firms').insert({ name: firm.name, time_zone: DEFAULT_TIME_ZONE });
  return id as number;
}

export function findFirm(db: Knex | Knex.Transaction, firmId: number): Promise<FirmRow | undefined> {
  return db<FirmRow>('firms').where({ id: firmId }).first();
}

/** What a new firm starts with: a depot to keep kit in, and the default item kinds. */
export async function setUpNewFirm(trx: Knex.Transaction, firmId: number): Promise<void> {
  await trx('locations').insert({ firm_id: firmId, kind: 'depot', name: 'Main depot' });
  await trx('item_kinds').insert(
    defaultItemKinds.map((k) => ({
      firm_id: firmId,
      name: k.name,
      interval_days: k.intervalDays,
      interval_uses: k.intervalUses,
      due_soon_days: k.dueSoonDays,
      overdue_policy: k.overduePolicy,
      electrical: k.electrical,
    })),
  );
}

interface FirmSettingsRow {
  id: number;
  name: string;
  address: string | null;
  time_zone: string;
  volume_unit: FirmSettings['volumeUnit'];
  cold_bottom_threshold_k: string | number | null;
  phone: string | null;
  email: string | null;
  registration_numbers: string | null;
  heat_exchanger_defaults: string | HeatExchangerDefaults | null;
  restock_days: number;
}

/** A JSON column as MariaDB hands it back (a string), parsed against the domain's schema; null if unset or unreadable. */
function parseHeatExchangerDefaults(v: string | HeatExchangerDefaults | null): HeatExchangerDefaults | null {
  if (v === null) return null;
  const parsed = heatExchangerDefaultsSchema.safeParse(typeof v === 'string' ? JSON.parse(v) : v);
  return parsed.success ? parsed.data : null;
}

/** The firm's own heat exchanger defaults, or null while it uses the built-in ones. */
export async function findHeatExchangerDefaults(
  db: Knex | Knex.Transaction,
  firmId: number,
): Promise<HeatExchangerDefaults | null> {
  const row = (await db('firms').where({ id: firmId }).first('heat_exchanger_defaults')) as
    Pick<FirmSettingsRow, 'heat_exchanger_defaults'> | undefined;
  return row ? parseHeatExchangerDefaults(row.heat_exchanger_defaults) : null;
}

export async function findFirmSettings(db: Knex | Knex.Transaction, firmId: number): Promise<FirmSettings | undefined> {
  const row = (await db('firms')
    .where({ id: firmId })
    .first(
      'id',
      'name',
      'address',
      'time_zone',
      'volume_unit',
      'cold_bottom_threshold_k',
      'phone',
      'email',
      'registration_numbers',
      'heat_exchanger_defaults',
      'restock_days',
    )) as FirmSettingsRow | undefined;
  const own = row ? parseHeatExchangerDefaults(row.heat_exchanger_defaults) : null;
  return (
    row && {
      id: row.id,
      name: row.name,
      address: row.address,
      timeZone: row.time_zone,
      volumeUnit: row.volume_unit,
      coldBottomThresholdK:
        row.cold_bottom_threshold_k === null ? DEFAULT_COLD_BOTTOM_THRESHOLD_K : Number(row.cold_bottom_threshold_k),
      phone: row.phone,
      email: row.email,
      registrationNumbers: row.registration_numbers,
      heatExchangerDefaults: own ?? builtInHeatExchangerLitres,
      heatExchangerDefaultsOwn: own !== null,
      restockDays: Number(row.restock_days),
    }
  );
}

export async function updateFirmSettings(
  db: Knex | Knex.Transaction,
  firmId: number,
  input: FirmSettingsInput,
): Promise<void> {
  await db('firms')
    .where({ id: firmId })
    .update({
      name: input.name,
      address: input.address ?? null,
      time_zone: input.timeZone,
      volume_unit: input.volumeUnit,
      cold_bottom_threshold_k: input.coldBottomThresholdK,
      // Left out of the input: unchanged (clients that predate these fields keep them).
      ...(input.phone !== undefined && { phone: input.phone }),
      ...(input.email !== undefined && { email: input.email }),
      ...(input.registrationNumbers !== undefined && { registration_numbers: input.registrationNumbers }),
      ...(input.heatExchangerDefaults !== undefined && {
        heat_exchanger_defaults:
          input.heatExchangerDefaults === null ? null : JSON.stringify(input.heatExchangerDefaults),
      }),
      ...(input.restockDays !== undefined && { restock_days: input.restockDays }),
    });
}
