import type { Knex } from 'knex';

// Each item keeps its last inspection and its uses since it (issue 16), so the kits pages read them as plain
// columns instead of two correlated counts per item: last_inspected_on (the latest inspection day),
// last_inspection_at (when the latest inspection was recorded; uses after it count) and uses_since_inspection
// (check-ins and completed-job uses since then; DEVELOPERS.md, Product rules: inspection due). The next migration
// keeps them current; here they are added and filled from the records.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('kit_items', (t) => {
    t.date('last_inspected_on').nullable();
    t.timestamp('last_inspection_at', { precision: 3 }).nullable();
    t.integer('uses_since_inspection').unsigned().notNullable().defaultTo(0);
  });
  await knex.raw(`
    UPDATE kit_items i
    LEFT JOIN (
      SELECT firm_id, item_id, MAX(inspected_on) AS last_on, MAX(created_at) AS last_at
      FROM inspections GROUP BY firm_id, item_id
    ) li ON li.firm_id = i.firm_id AND li.item_id = i.id
    SET i.last_inspected_on = li.last_on, i.last_inspection_at = li.last_at`);
  await knex.raw(`
    UPDATE kit_items i SET i.uses_since_inspection =
      (SELECT COUNT(*) FROM custody_events e
        WHERE e.firm_id = i.firm_id AND e.item_id = i.id AND e.action = 'check_in'
          AND e.created_at > COALESCE(i.last_inspection_at, '1970-01-01'))
      + (SELECT COUNT(*) FROM kit_item_uses ku
        WHERE ku.firm_id = i.firm_id AND ku.item_id = i.id AND ku.used_at > COALESCE(i.last_inspection_at, '1970-01-01'))`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('kit_items', (t) => {
    t.dropColumn('last_inspected_on');
    t.dropColumn('last_inspection_at');
    t.dropColumn('uses_since_inspection');
  });
}
