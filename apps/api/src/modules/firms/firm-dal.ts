import type { Knex } from 'knex';
import { DEFAULT_TIME_ZONE } from '@heatfleet/domain';

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
