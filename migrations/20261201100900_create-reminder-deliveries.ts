import type { Knex } from 'knex';

// Which digest e-mail carried which reminder to whom.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('reminder_deliveries', (t) => {
    t.bigIncrements('id').primary();
    t.integer('firm_id').unsigned().notNullable().references('firms.id').onDelete('CASCADE');
    t.bigInteger('reminder_id').unsigned().notNullable().references('reminders.id');
    t.integer('email_id').unsigned().notNullable().references('emails.id');
    t.string('recipient', 254).notNullable();
    t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['firm_id', 'created_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('reminder_deliveries');
}
