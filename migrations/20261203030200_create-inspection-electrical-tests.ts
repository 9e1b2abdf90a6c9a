import type { Knex } from 'knex';

// The in-service inspection and test of an electrical item (IET Code of Practice for In-service Inspection
// and Testing of Electrical Equipment): what was measured, one row per inspection that included a test.
// The outcome is worked out from these by the domain's electricalTestOutcome.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('inspection_electrical_tests', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('inspection_id').unsigned().notNullable().references('inspections.id');
    t.enum('equipment_class', ['I', 'II']).notNullable();
    t.enum('visual', ['pass', 'fail']).notNullable();
    t.decimal('earth_continuity_ohms', 8, 3).nullable();
    t.decimal('cord_length_m', 6, 2).nullable();
    t.decimal('cord_size_mm2', 4, 2).nullable();
    t.decimal('insulation_resistance_mohms', 10, 2).nullable();
    t.enum('polarity', ['pass', 'fail', 'not_applicable']).notNullable();
    t.string('tester_used', 80).notNullable();
    t.date('tester_calibrated_on').notNullable();
    t.unique(['firm_id', 'inspection_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('inspection_electrical_tests');
}
