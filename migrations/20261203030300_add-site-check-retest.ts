import type { Knex } from 'knex';

// An inhibitor check visit that failed may be topped up from the van and re-tested in the same visit:
// the re-test's reading, the packs taken (the ledger's movement group) and the next check the visit set
// (sooner than a year when it still failed). `result` is the visit's outcome: the re-test's when there was one.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('site_checks', (t) => {
    t.decimal('retest_reading', 10, 3).nullable();
    t.integer('top_up_packs').unsigned().nullable();
    t.integer('top_up_location_id').unsigned().nullable().references('locations.id');
    t.string('top_up_group_id', 36).nullable();
    t.date('next_check_on').nullable();
    t.integer('note_email_id').unsigned().nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('site_checks', (t) => {
    t.dropForeign(['top_up_location_id']);
    t.dropColumn('retest_reading');
    t.dropColumn('top_up_packs');
    t.dropColumn('top_up_location_id');
    t.dropColumn('top_up_group_id');
    t.dropColumn('next_check_on');
    t.dropColumn('note_email_id');
  });
}
