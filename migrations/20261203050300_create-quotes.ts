import type { Knex } from 'knex';

// A quote for a job: its own number, validity, the customer's link (only the token's SHA-256 is kept,
// with its expiry) and the acceptance: name, when, how (link or phone with a signature) and whether the
// customer asked for the work within the cancellation period (Consumer Contracts Regulations 2013, reg. 36).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('quotes', (t) => {
    t.increments('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.integer('job_id').unsigned().notNullable().references('jobs.id');
    t.integer('number').unsigned().notNullable();
    t.enum('status', ['draft', 'sent', 'accepted', 'declined']).notNullable().defaultTo('draft');
    t.date('valid_until').notNullable();
    t.boolean('vat_registered').notNullable();
    t.string('notes', 1000).nullable();
    t.integer('net_pence').notNullable();
    t.integer('vat_pence').notNullable();
    t.integer('total_pence').notNullable();
    t.string('token_hash', 64).nullable().unique();
    t.timestamp('token_expires_at', { precision: 3 }).nullable();
    t.timestamp('sent_at', { precision: 3 }).nullable();
    t.string('accepted_name', 120).nullable();
    t.timestamp('accepted_at', { precision: 3 }).nullable();
    t.enum('accepted_via', ['link', 'phone']).nullable();
    t.boolean('express_request').nullable();
    t.string('signature_key', 300).nullable();
    t.timestamp('declined_at', { precision: 3 }).nullable();
    t.string('decline_reason', 500).nullable();
    t.integer('created_by_user_id').unsigned().nullable().references('users.id');
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(['firm_id', 'number']);
    t.index(['firm_id', 'job_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('quotes');
}
