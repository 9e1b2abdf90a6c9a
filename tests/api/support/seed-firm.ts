import type { Knex } from 'knex';
import { roles, type Role } from '@heatfleet/domain';
import { hashPassword } from '@heatfleet/api/modules/auth/password.ts';
import { createToken } from '@heatfleet/api/lib/tokens.ts';
import { TEST_PASSWORD, uniqueEmail } from './test-app.ts';

export interface SeededFirm {
  firmId: number;
  firmName: string;
  /** One signed-in-able person per role. */
  people: Record<Role, { email: string; userId: number; memberId: number }>;
  /** An extra engineer to act upon. */
  target: { email: string; userId: number; memberId: number };
  invitation: { id: number; email: string; token: string };
  emailId: number;
  /** Strings that belong to this firm only: none may appear in another firm's answers. */
  sentinels: string[];
}

let hash: Promise<string> | undefined;

/** One of every record a firm has, written straight to the database (faster than the API). */
export async function seedFirm(db: Knex, label: string): Promise<SeededFirm> {
  hash ??= hashPassword(TEST_PASSWORD);
  const passwordHash = await hash;
  const firmName = `Seeded ${label} ${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;
  return db.transaction(async (trx) => {
    const [firmId] = (await trx('firms').insert({ name: firmName, time_zone: 'Europe/London' })) as number[];
    const addPerson = async (role: Role, name: string) => {
      const email = uniqueEmail(`${label}-${name}`);
      const [userId] = (await trx('users').insert({ email, name: `${label} ${name}`, password_hash: passwordHash })) as number[];
      const [memberId] = (await trx('memberships').insert({ firm_id: firmId, user_id: userId, role, active: true })) as number[];
      return { email, userId: userId!, memberId: memberId! };
    };
    const people = {} as SeededFirm['people'];
    for (const role of roles) people[role] = await addPerson(role, role);
    const target = await addPerson('engineer', 'target');
    const { token, tokenHash } = createToken();
    const inviteEmail = uniqueEmail(`${label}-invitee`);
    const [invitationId] = (await trx('invitations').insert({
      firm_id: firmId,
      email: inviteEmail,
      role: 'engineer',
      token_hash: tokenHash,
      invited_by_user_id: people.owner.userId,
      expires_at: new Date(Date.now() + 7 * 86_400_000),
    })) as number[];
    const [emailId] = (await trx('emails').insert({
      firm_id: firmId,
      to_address: inviteEmail,
      subject: `Invitation to ${firmName}`,
      text_body: 'seeded',
      purpose: 'invitation',
      sent_at: new Date(),
    })) as number[];
    const sentinels = [firmName, inviteEmail, target.email, ...roles.map((r) => people[r].email)];
    return { firmId: firmId!, firmName, people, target, invitation: { id: invitationId!, email: inviteEmail, token }, emailId: emailId!, sentinels };
  });
}

/** Every row of every table that has firm_id, for this firm: the isolation test compares before and after. */
export async function snapshotFirm(db: Knex, firmId: number): Promise<Record<string, unknown[]>> {
  const tables = await tenantTables(db);
  const snapshot: Record<string, unknown[]> = { firms: await db('firms').where({ id: firmId }) };
  for (const table of tables) snapshot[table] = await db(table).where({ firm_id: firmId }).orderBy('id');
  return snapshot;
}

export async function tenantTables(db: Knex): Promise<string[]> {
  const [rows] = (await db.raw(
    "SELECT table_name AS name FROM information_schema.columns WHERE table_schema = DATABASE() AND column_name = 'firm_id' ORDER BY table_name",
  )) as [{ name: string }[]];
  return rows.map((r) => r.name);
}

export async function allTables(db: Knex): Promise<string[]> {
  const [rows] = (await db.raw('SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE()')) as [{ name: string }[]];
  return rows.map((r) => r.name);
}
