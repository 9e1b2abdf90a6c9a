import type { Pool } from 'mysql2/promise';

/** Rows per INSERT; each statement commits on its own (autocommit), so a transaction holds this many rows. */
export const rowsPerInsert = 2_500;

/**
 * Collects rows for one table and writes them as multi-row INSERTs of `rowsPerInsert`, with up to two
 * statements in flight so MariaDB parses one while it writes the other.
 */
export class BulkWriter {
  private rows: unknown[][] = [];
  private inFlight: Promise<unknown>[] = [];
  written = 0;

  constructor(
    private readonly pool: Pool,
    private readonly table: string,
    private readonly columns: string[],
    private readonly onProgress?: (written: number) => void,
    /** 1 for a table whose triggers update shared rows (custody events and inspections update kit_items): two
     * statements in flight there deadlock each other. */
    private readonly maxInFlight = 2,
  ) {}

  async add(row: unknown[]): Promise<void> {
    this.rows.push(row);
    if (this.rows.length >= rowsPerInsert) await this.flushSome();
  }

  private async flushSome(): Promise<void> {
    const chunk = this.rows;
    this.rows = [];
    const statement = this.pool
      .query(`INSERT INTO \`${this.table}\` (${this.columns.map((c) => `\`${c}\``).join(', ')}) VALUES ?`, [chunk])
      .then(() => {
        this.written += chunk.length;
        this.onProgress?.(this.written);
      });
    this.inFlight.push(statement);
    if (this.inFlight.length >= this.maxInFlight) await this.inFlight.shift();
  }

  async close(): Promise<number> {
    if (this.rows.length > 0) await this.flushSome();
    await Promise.all(this.inFlight.splice(0));
    return this.written;
  }
}

/** Inserts rows one statement at a time and returns their auto-increment ids, in order (InnoDB's consecutive ids). */
export async function insertReturningIds(
  pool: Pool,
  table: string,
  columns: string[],
  rows: unknown[][],
): Promise<number[]> {
  const ids: number[] = [];
  for (let i = 0; i < rows.length; i += rowsPerInsert) {
    const chunk = rows.slice(i, i + rowsPerInsert);
    const [result] = await pool.query(
      `INSERT INTO \`${table}\` (${columns.map((c) => `\`${c}\``).join(', ')}) VALUES ?`,
      [chunk],
    );
    const first = (result as { insertId: number }).insertId;
    for (let n = 0; n < chunk.length; n += 1) ids.push(first + n);
  }
  return ids;
}
