import type { Knex } from 'knex';

// Every e-mail is written here before it is handed to the queue, so none is lost if Redis
// or the SMTP server is down; the worker marks it sent.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('emails', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().nullable().references('firms.id').onDelete('CASCADE');
    t.string('to_address', 254).notNullable();
    t.string('subject', 200).notNullable();
    t.text('text_body').notNullable();
    t.text('html_body').nullable();
    t.string('purpose', 40).notNullable();
    t.integer('attempts').unsigned().notNullable().defaultTo(0);
    t.string('last_error', 500).nullable();
    // A delivery holds the row until then, so two workers never send the same e-mail at once.
    t.timestamp('claimed_until', { precision: 3 }).nullable();
    t.timestamp('sent_at', { precision: 3 }).nullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['sent_at', 'created_at']);
    t.index(['firm_id', 'created_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('emails');
}
