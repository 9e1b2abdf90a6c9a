import type { Knex } from 'knex';

// The firm's phone, e-mail and registration numbers (free text), printed on the customer's report.
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasColumn('firms', 'phone')) return;
  await knex.schema.alterTable('firms', (t) => {
    t.string('phone', 40).nullable();
    t.string('email', 254).nullable();
    t.string('registration_numbers', 300).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('firms', (t) => {
    t.dropColumn('phone');
    t.dropColumn('email');
    t.dropColumn('registration_numbers');
  });
}
