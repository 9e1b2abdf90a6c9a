import type { Knex } from 'knex';

// An e-mail may carry one file (a job's completion report), kept in object storage until it is sent.
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasColumn('emails', 'attachment_key')) return;
  await knex.schema.alterTable('emails', (t) => {
    t.string('attachment_key', 200).nullable();
    t.string('attachment_name', 120).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('emails', (t) => {
    t.dropColumn('attachment_key');
    t.dropColumn('attachment_name');
  });
}
