import type { Knex } from 'knex';

// The item's inspection columns (previous migration) are kept by the database in the same transaction as every
// inspection, check-in and job use written or removed: the API's writes, but also the seeds, the bench generator and
// test fixtures that write those tables directly, so no writer can leave them stale. The procedure recounts one
// item from its records (indexed: inspections (firm_id, item_id, ...), custody_events (firm_id, item_id, action,
// created_at), kit_item_uses (firm_id, item_id, used_at)), the same counts the kits list used to make per request.
const procedure = `
CREATE OR REPLACE PROCEDURE refresh_kit_item_inspection_state(p_firm INT UNSIGNED, p_item INT UNSIGNED)
BEGIN
  DECLARE v_on DATE;
  DECLARE v_at TIMESTAMP(3);
  SELECT MAX(inspected_on), MAX(created_at) INTO v_on, v_at FROM inspections WHERE firm_id = p_firm AND item_id = p_item;
  UPDATE kit_items SET
    last_inspected_on = v_on,
    last_inspection_at = v_at,
    uses_since_inspection =
      (SELECT COUNT(*) FROM custody_events e
        WHERE e.firm_id = p_firm AND e.item_id = p_item AND e.action = 'check_in'
          AND e.created_at > COALESCE(v_at, '1970-01-01'))
      + (SELECT COUNT(*) FROM kit_item_uses ku
        WHERE ku.firm_id = p_firm AND ku.item_id = p_item AND ku.used_at > COALESCE(v_at, '1970-01-01'))
  WHERE firm_id = p_firm AND id = p_item;
END`;

const triggers: [
  name: string,
  table: string,
  event: 'INSERT' | 'UPDATE' | 'DELETE',
  row: 'NEW' | 'OLD',
  when?: string,
][] = [
  ['kit_item_state_inspection_insert', 'inspections', 'INSERT', 'NEW'],
  ['kit_item_state_inspection_update', 'inspections', 'UPDATE', 'NEW'],
  ['kit_item_state_inspection_delete', 'inspections', 'DELETE', 'OLD'],
  ['kit_item_state_custody_insert', 'custody_events', 'INSERT', 'NEW', "NEW.action = 'check_in'"],
  ['kit_item_state_custody_delete', 'custody_events', 'DELETE', 'OLD', "OLD.action = 'check_in'"],
  ['kit_item_state_use_insert', 'kit_item_uses', 'INSERT', 'NEW'],
  ['kit_item_state_use_delete', 'kit_item_uses', 'DELETE', 'OLD'],
];

export async function up(knex: Knex): Promise<void> {
  await knex.raw(procedure);
  for (const [name, table, event, row, when] of triggers) {
    const call = `CALL refresh_kit_item_inspection_state(${row}.firm_id, ${row}.item_id)`;
    await knex.raw(
      `CREATE OR REPLACE TRIGGER ${name} AFTER ${event} ON ${table} FOR EACH ROW ${when ? `IF ${when} THEN ${call}; END IF` : call}`,
    );
  }
}

export async function down(knex: Knex): Promise<void> {
  for (const [name] of triggers) await knex.raw(`DROP TRIGGER IF EXISTS ${name}`);
  await knex.raw('DROP PROCEDURE IF EXISTS refresh_kit_item_inspection_state');
}
