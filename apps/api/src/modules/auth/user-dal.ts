import type { Knex } from 'knex';

// Users are people, not tenant data: one account may belong to several firms.
export interface UserRow {
  id: number;
  email: string;
  name: string;
  password_hash: string;
}

export function findUserByEmail(db: Knex | Knex.Transaction, email: string): Promise<UserRow | undefined> {
  return db<UserRow>('users').where({ email }).first();
}

export function findUserById(db: Knex | Knex.Transaction, id: number): Promise<UserRow | undefined> {
  return db<UserRow>('users').where({ id }).first();
}

export async function insertUser(
  trx: Knex.Transaction,
  user: { email: string; name: string; passwordHash: string },
): Promise<number> {
  const [id] = await trx('users').insert({ email: user.email, name: user.name, password_hash: user.passwordHash });
  return id as number;
}

export async function updatePasswordHash(
  trx: Knex | Knex.Transaction,
  userId: number,
  passwordHash: string,
  at: Date,
): Promise<void> {
  await trx('users').where({ id: userId }).update({ password_hash: passwordHash, password_changed_at: at });
}
