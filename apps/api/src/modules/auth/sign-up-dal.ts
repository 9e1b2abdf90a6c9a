import type { Knex } from 'knex';

// Not tenant data: no firm exists until the e-mail is confirmed.
export interface SignUpRequestRow {
  id: number;
  email: string;
  name: string;
  firm_name: string;
  password_hash: string;
  expires_at: Date;
  used_at: Date | null;
}

export async function insertSignUpRequest(
  trx: Knex.Transaction,
  row: {
    email: string;
    name: string;
    firmName: string;
    passwordHash: string;
    tokenHash: string;
    expiresAt: Date;
    usedAt?: Date;
  },
): Promise<void> {
  await trx('sign_up_requests').insert({
    email: row.email,
    name: row.name,
    firm_name: row.firmName,
    password_hash: row.passwordHash,
    token_hash: row.tokenHash,
    expires_at: row.expiresAt,
    used_at: row.usedAt ?? null,
  });
}

export function findSignUpRequestForUpdate(
  trx: Knex.Transaction,
  tokenHash: string,
): Promise<SignUpRequestRow | undefined> {
  return trx('sign_up_requests')
    .where({ token_hash: tokenHash })
    .forUpdate()
    .first<SignUpRequestRow | undefined>('id', 'email', 'name', 'firm_name', 'password_hash', 'expires_at', 'used_at');
}

/** Ends every open request of the address once one of them has made the account. */
export async function endSignUpRequests(trx: Knex.Transaction, email: string, at: Date): Promise<void> {
  await trx('sign_up_requests').where({ email }).whereNull('used_at').update({ used_at: at });
}
