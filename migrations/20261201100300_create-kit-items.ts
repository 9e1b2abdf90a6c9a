import type { Knex } from 'knex';

// One piece of kit. location_id is a cache of the custody log's latest event, written in the same
// transaction as the event, so lists need not replay the log; the log stays the record.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('kit_items', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('kit_id').unsigned().nullable().references('kits.id').onDelete('SET NULL');
    t.integer('kind_id').unsigned().notNullable().references('item_kinds.id');
    t.string('asset_tag', 32).notNullable();
    t.string('serial_number', 80).nullable();
    t.enum('condition', ['in_service', 'needs_attention', 'out_of_service']).notNullable().defaultTo('in_service');
    t.string('notes', 1000).nullable();
    t.integer('location_id').unsigned().nullable().references('locations.id');
    t.date('in_service_since').notNullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(['firm_id', 'asset_tag']);
    t.index(['firm_id', 'kit_id']);
    t.index(['firm_id', 'location_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('kit_items');
}
