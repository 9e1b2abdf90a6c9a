import type { Knex } from 'knex';

// Append-only: every check-out, check-in and move. Nothing here is ever updated or deleted.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('custody_events', (t) => {
    t.bigIncrements('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('item_id').unsigned().notNullable().references('kit_items.id');
    t.integer('kit_id').unsigned().nullable().references('kits.id');
    t.enum('action', ['check_out', 'check_in', 'move']).notNullable();
    t.integer('from_location_id').unsigned().nullable().references('locations.id');
    t.integer('to_location_id').unsigned().nullable().references('locations.id');
    t.integer('by_user_id').unsigned().notNullable().references('users.id');
    t.enum('condition', ['in_service', 'needs_attention', 'out_of_service']).nullable();
    t.string('missing_parts', 500).nullable();
    t.string('note', 1000).nullable();
    t.string('overdue_reason', 500).nullable();
    t.integer('photo_id').unsigned().nullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['firm_id', 'item_id', 'id']);
    t.index(['firm_id', 'kit_id', 'id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('custody_events');
}
