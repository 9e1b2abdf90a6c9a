import type { Knex } from 'knex';

// Sessions are a person's, not a firm's: connect-session-knex keeps them in `sessions` as JSON.

/** Ends every session of a person, except the one given (the one making the change). */
export async function endSessionsOfUser(db: Knex, userId: number, exceptSid?: string): Promise<number> {
  const query = db('sessions').whereRaw("JSON_VALUE(sess, '$.userId') = ?", [userId]);
  if (exceptSid) query.whereNot('sid', exceptSid);
  return query.del();
}
