import type { Knex } from 'knex';
import type { Invitation, Role } from '@heatfleet/domain';

export interface InvitationRow {
  id: number;
  firm_id: number;
  email: string;
  role: Role;
  invited_by_user_id: number;
  expires_at: Date;
  accepted_at: Date | null;
  withdrawn_at: Date | null;
  created_at: Date;
}

export async function insertInvitation(
  trx: Knex.Transaction,
  inv: { firmId: number; email: string; role: Role; tokenHash: string; invitedBy: number; expiresAt: Date },
): Promise<number> {
  const [id] = await trx('invitations').insert({
    firm_id: inv.firmId,
    email: inv.email,
    role: inv.role,
    token_hash: inv.tokenHash,
    invited_by_user_id: inv.invitedBy,
    expires_at: inv.expiresAt,
  });
  return id as number;
}

function pending(db: Knex | Knex.Transaction, firmId: number, now: Date) {
  return db('invitations as i')
    .where('i.firm_id', firmId)
    .whereNull('i.accepted_at')
    .whereNull('i.withdrawn_at')
    .where('i.expires_at', '>', now);
}

export async function listPendingInvitations(
  db: Knex | Knex.Transaction,
  firmId: number,
  now: Date,
  id?: number,
): Promise<Invitation[]> {
  const query = pending(db, firmId, now)
    .join('users as u', 'u.id', 'i.invited_by_user_id')
    .orderBy('i.id', 'desc')
    .select('i.id', 'i.email', 'i.role', 'u.name as invited_by', 'i.expires_at', 'i.accepted_at', 'i.created_at');
  if (id !== undefined) query.where('i.id', id);
  const rows: (InvitationRow & { invited_by: string })[] = await query;
  return rows.map((r) => ({
    id: r.id,
    email: r.email,
    role: r.role,
    invitedBy: r.invited_by,
    expiresAt: r.expires_at.toISOString(),
    acceptedAt: r.accepted_at?.toISOString() ?? null,
    createdAt: r.created_at.toISOString(),
  }));
}

/** Withdraws the firm's other open invitations to the same address, so only the newest link works. */
export async function withdrawPendingFor(
  trx: Knex.Transaction,
  firmId: number,
  email: string,
  now: Date,
): Promise<void> {
  await pending(trx, firmId, now).where('i.email', email).update({ withdrawn_at: now });
}

export async function withdrawInvitation(
  trx: Knex.Transaction,
  firmId: number,
  id: number,
  now: Date,
): Promise<number> {
  return pending(trx, firmId, now).where('i.id', id).update({ withdrawn_at: now });
}

/** Found by its token alone (the invitee has no firm yet); locked when accepting. */
export async function findUsableInvitationByTokenHash(
  db: Knex | Knex.Transaction,
  tokenHash: string,
  now: Date,
  opts: { forUpdate?: boolean } = {},
) {
  const query = db('invitations as i')
    .join('firms as f', 'f.id', 'i.firm_id')
    .where('i.token_hash', tokenHash)
    .whereNull('i.accepted_at')
    .whereNull('i.withdrawn_at')
    .where('i.expires_at', '>', now)
    .first('i.*', 'f.name as firm_name');
  if (opts.forUpdate) query.forUpdate();
  const row: (InvitationRow & { firm_name: string }) | undefined = await query;
  return row;
}

export async function markInvitationAccepted(
  trx: Knex.Transaction,
  firmId: number,
  id: number,
  now: Date,
): Promise<void> {
  await trx('invitations').where({ firm_id: firmId, id }).update({ accepted_at: now });
}
