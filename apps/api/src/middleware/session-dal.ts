import type { Knex } from 'knex';
import type { Role } from '@heatfleet/domain';

export interface StoredSession {
  /** The session as connect-session-knex stored it (JSON). */
  sess: unknown;
  /** The active membership of the session's person in its firm, read in the same query; null if none. */
  membership: { id: number; role: Role } | null;
}

/**
 * One indexed read per signed-in request: the session row by its primary key, and the active membership
 * of its person in its active firm by `memberships (firm_id, user_id)`, the unique index.
 */
export async function readSessionWithMembership(db: Knex, sid: string, now: Date): Promise<StoredSession | undefined> {
  const row: { sess: unknown; member_id: number | null; role: Role | null } | undefined = await db('sessions as s')
    .leftJoin('memberships as m', function () {
      this.on('m.firm_id', '=', db.raw("CAST(JSON_VALUE(s.sess, '$.firmId') AS UNSIGNED)"))
        .andOn('m.user_id', '=', db.raw("CAST(JSON_VALUE(s.sess, '$.userId') AS UNSIGNED)"))
        .andOn('m.active', '=', db.raw('1'));
    })
    .where('s.sid', sid)
    .andWhere('s.expired', '>=', now)
    .first('s.sess', 'm.id as member_id', 'm.role');
  if (!row) return undefined;
  const sess = typeof row.sess === 'string' ? (JSON.parse(row.sess) as unknown) : row.sess;
  return {
    sess,
    membership: row.member_id !== null && row.role !== null ? { id: row.member_id, role: row.role } : null,
  };
}
