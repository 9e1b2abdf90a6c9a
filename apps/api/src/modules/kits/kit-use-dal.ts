import type { Knex } from 'knex';

type Db = Knex | Knex.Transaction;

/**
 * Kit marked as used on a job counts, at the job's completion, as one use of each item for its
 * inspection rule (DEVELOPERS.md, Product rules: inspection due). Written once per item and job.
 */
export async function recordKitUses(trx: Knex.Transaction, firmId: number, jobId: number, at: Date): Promise<void> {
  await trx.raw(
    `INSERT IGNORE INTO kit_item_uses (firm_id, item_id, job_id, used_at)
     SELECT firm_id, kit_item_id, job_id, ? FROM job_kit_items WHERE firm_id = ? AND job_id = ?`,
    [at, firmId, jobId],
  );
}

/**
 * An item's uses since its last inspection, for a query over `kit_items as i`: check-ins and uses
 * on completed jobs recorded after the last inspection was. `lastInspectedAt` is a correlated
 * subquery of that inspection's created_at.
 */
export function usesSinceInspection(db: Db, lastInspectedAt: Knex.QueryBuilder): Knex.Raw {
  const checkIns = db('custody_events as e')
    .whereRaw('e.firm_id = i.firm_id')
    .whereRaw('e.item_id = i.id')
    .where('e.action', 'check_in')
    .whereRaw("e.created_at > COALESCE((?), '1970-01-01')", [lastInspectedAt.clone()])
    .count('*');
  const jobUses = db('kit_item_uses as ku')
    .whereRaw('ku.firm_id = i.firm_id')
    .whereRaw('ku.item_id = i.id')
    .whereRaw("ku.used_at > COALESCE((?), '1970-01-01')", [lastInspectedAt.clone()])
    .count('*');
  return db.raw('(?) + (?) AS uses_since_inspection', [checkIns, jobUses]);
}

/** Job uses per item since each item's last inspection, for the whole firm in one query (the overview). */
export function jobUsesByItem(db: Db, firmId: number) {
  return db('kit_item_uses as ku')
    .leftJoin(
      db('inspections')
        .where('firm_id', firmId)
        .groupBy('item_id')
        .select('item_id')
        .max({ last_at: 'created_at' })
        .as('li'),
      'li.item_id',
      'ku.item_id',
    )
    .where('ku.firm_id', firmId)
    .whereRaw("ku.used_at > COALESCE(li.last_at, '1970-01-01')")
    .groupBy('ku.item_id')
    .select('ku.item_id')
    .count({ n: '*' }) as Promise<{ item_id: number; n: number | string }[]>;
}
