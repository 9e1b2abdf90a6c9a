import type { Knex } from 'knex';

// Not tenant data: a reset belongs to a person's account, which may span several firms.
export interface PasswordResetRow {
  id: number;
  user_id: number;
  expires_at: Date;
  used_at: Date | null;
}

export async function insertPasswordReset(
  trx: Knex.Transaction,
  row: { userId: number; tokenHash: string; expiresAt: Date },
): Promise<void> {
  await trx('password_resets').insert({ user_id: row.userId, token_hash: row.tokenHash, expires_at: row.expiresAt });
}

export function findPasswordResetForUpdate(
  trx: Knex.Transaction,
  tokenHash: string,
): Promise<PasswordResetRow | undefined> {
  return trx('password_resets')
    .where({ token_hash: tokenHash })
    .forUpdate()
    .first<PasswordResetRow | undefined>('id', 'user_id', 'expires_at', 'used_at');
}

/** Ends every link of the account still open: a new link, a reset or a password change makes them stale. */
export async function endOpenPasswordResets(db: Knex | Knex.Transaction, userId: number, at: Date): Promise<number> {
  return db('password_resets').where({ user_id: userId }).whereNull('used_at').update({ used_at: at });
}
