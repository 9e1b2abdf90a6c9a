import type { Knex } from 'knex';
import type { Member, Membership, Role } from '@heatfleet/domain';

interface MemberRow {
  id: number;
  firm_id: number;
  user_id: number;
  role: Role;
  active: number;
  created_at: Date;
  name: string;
  email: string;
}

function toMember(row: MemberRow): Member & { firmId: number } {
  return {
    id: row.id,
    firmId: row.firm_id,
    userId: row.user_id,
    name: row.name,
    email: row.email,
    role: row.role,
    active: Boolean(row.active),
    joinedAt: row.created_at.toISOString(),
  };
}

const memberColumns = ['m.id', 'm.firm_id', 'm.user_id', 'm.role', 'm.active', 'm.created_at', 'u.name', 'u.email'];

function members(db: Knex | Knex.Transaction, firmId: number) {
  return db('memberships as m').join('users as u', 'u.id', 'm.user_id').where('m.firm_id', firmId);
}

export async function listMembers(db: Knex, firmId: number): Promise<Member[]> {
  const rows: MemberRow[] = await members(db, firmId).select(memberColumns).orderBy('u.name');
  return rows.map(toMember);
}

export async function findMember(
  db: Knex | Knex.Transaction,
  firmId: number,
  memberId: number,
  opts: { forUpdate?: boolean } = {},
) {
  const query = members(db, firmId).where('m.id', memberId).first(memberColumns);
  if (opts.forUpdate) query.forUpdate();
  const row: MemberRow | undefined = await query;
  return row ? toMember(row) : undefined;
}

export async function findMemberByUser(db: Knex | Knex.Transaction, firmId: number, userId: number) {
  const row: MemberRow | undefined = await members(db, firmId).where('m.user_id', userId).first(memberColumns);
  return row ? toMember(row) : undefined;
}

export async function findActiveMembership(
  db: Knex,
  userId: number,
  firmId: number,
): Promise<{ id: number; role: Role } | undefined> {
  return db('memberships').where({ user_id: userId, firm_id: firmId, active: true }).first('id', 'role');
}

/** The person's active memberships with firm names, oldest first. */
export async function listMembershipsOfUser(db: Knex | Knex.Transaction, userId: number): Promise<Membership[]> {
  const rows: { id: number; firm_id: number; name: string; role: Role }[] = await db('memberships as m')
    .join('firms as f', 'f.id', 'm.firm_id')
    .where({ 'm.user_id': userId, 'm.active': true })
    .orderBy('m.id')
    .select('m.id', 'm.firm_id', 'f.name', 'm.role');
  return rows.map((r) => ({ memberId: r.id, firmId: r.firm_id, firmName: r.name, role: r.role }));
}

export async function insertMembership(
  trx: Knex.Transaction,
  m: { firmId: number; userId: number; role: Role },
): Promise<number> {
  const [id] = await trx('memberships').insert({ firm_id: m.firmId, user_id: m.userId, role: m.role, active: true });
  return id as number;
}

export async function updateMembership(
  trx: Knex.Transaction,
  firmId: number,
  memberId: number,
  patch: { role?: Role; active?: boolean },
) {
  await trx('memberships').where({ firm_id: firmId, id: memberId }).update(patch);
}

/** Locks the firm's active Owner rows, so two concurrent demotions cannot both pass the last-Owner check. */
export async function lockActiveOwnerIds(trx: Knex.Transaction, firmId: number): Promise<number[]> {
  const rows: { id: number }[] = await trx('memberships')
    .where({ firm_id: firmId, role: 'owner', active: true })
    .forUpdate()
    .select('id');
  return rows.map((r) => r.id);
}
