import type { Knex } from 'knex';

// Each completed job's report number, unique in its firm. Jobs completed before this are numbered
// in the order they were completed, and the firm's sequence carries on after them.
export async function up(knex: Knex): Promise<void> {
  if (!(await knex.schema.hasColumn('jobs', 'report_number'))) {
    await knex.schema.alterTable('jobs', (t) => {
      t.integer('report_number').unsigned().nullable();
      t.unique(['firm_id', 'report_number']);
    });
  }
  await knex.raw(`
    UPDATE jobs j
    JOIN (
      SELECT id, ROW_NUMBER() OVER (PARTITION BY firm_id ORDER BY completed_at, id) AS n
      FROM jobs WHERE status = 'completed' AND report_number IS NULL
    ) numbered ON numbered.id = j.id
    SET j.report_number = numbered.n`);
  await knex.raw(`
    UPDATE firms f
    JOIN (SELECT firm_id, MAX(report_number) AS last FROM jobs GROUP BY firm_id) m ON m.firm_id = f.id
    SET f.last_report_number = GREATEST(f.last_report_number, m.last)`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('jobs', (t) => {
    t.dropUnique(['firm_id', 'report_number']);
    t.dropColumn('report_number');
  });
}
