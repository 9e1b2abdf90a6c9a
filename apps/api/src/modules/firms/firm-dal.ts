import type { Knex } from 'knex';
import { DEFAULT_TIME_ZONE, defaultItemKinds } from '@heatfleet/domain';

export interface FirmRow {
  id: number;
  name: string;
  time_zone: string;
}

export async function insertFirm(trx: Knex.Transaction, firm: { name: string }): Promise<number> {
  const [id] = await trx('firms').insert({ name: firm.name, time_zone: DEFAULT_TIME_ZONE });
  return id as number;
}

export function findFirm(db: Knex, firmId: number): Promise<FirmRow | undefined> {
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
