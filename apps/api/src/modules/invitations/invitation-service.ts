import { withTransactionRetry } from '../../db/with-retry.ts';
import { ForbiddenError, subject } from '@casl/ability';
import {
  passwordSchema,
  personNameSchema,
  type AcceptInvitationInput,
  type CreateInvitationInput,
  type Invitation,
  type InvitationPreview,
} from '@heatfleet/domain';
import { z } from 'zod';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { conflict, HttpError, notFound } from '../../lib/http-error.ts';
import { createToken, hashToken } from '../../lib/tokens.ts';
import { findUserByEmail, findUserById, insertUser } from '../auth/user-dal.ts';
import { assertPasswordAcceptable, hashPassword, verifyPassword } from '../auth/password.ts';
import { findFirm } from '../firms/firm-dal.ts';
import { insertEmail } from '../mail/mail-dal.ts';
import { invitationEmail } from '../mail/mail-templates.ts';
import { findMemberByUser, insertMembership, updateMembership } from '../members/member-dal.ts';
import {
  findUsableInvitationByTokenHash,
  insertInvitation,
  listPendingInvitations,
  markInvitationAccepted,
  withdrawInvitation as withdrawInvitationRow,
  withdrawPendingFor,
} from './invitation-dal.ts';

export const INVITATION_LIFETIME_MS = 7 * 24 * 60 * 60 * 1000;
const INVALID_LINK =
  'This invitation link is not valid: it may have expired, been used or withdrawn. Ask for a new one.';

export async function listInvitations(deps: AppDeps, actor: Actor): Promise<Invitation[]> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Invitation');
  return listPendingInvitations(deps.db, actor.firmId, deps.clock.now());
}

export async function createInvitation(deps: AppDeps, actor: Actor, input: CreateInvitationInput): Promise<Invitation> {
  ForbiddenError.from(actor.ability).throwUnlessCan(
    'create',
    subject('Invitation', { firmId: actor.firmId, role: input.role }),
  );
  const now = deps.clock.now();
  const existingUser = await findUserByEmail(deps.db, input.email);
  if (existingUser) {
    const member = await findMemberByUser(deps.db, actor.firmId, existingUser.id);
    if (member?.active) throw conflict(`${input.email} is already a member of this firm.`);
  }
  const [firm, inviter] = await Promise.all([findFirm(deps.db, actor.firmId), findUserById(deps.db, actor.userId)]);
  const { token, tokenHash } = createToken();
  const expiresAt = new Date(now.getTime() + INVITATION_LIFETIME_MS);
  const link = new URL(`/invitations/${token}`, deps.env.APP_ORIGIN).toString();
  // Two invitations at once in one firm can deadlock on the pending-invitation rows: retried whole.
  const { invitation, emailId } = await withTransactionRetry(() =>
    deps.db.transaction(async (trx) => {
      await withdrawPendingFor(trx, actor.firmId, input.email, now);
      const id = await insertInvitation(trx, {
        firmId: actor.firmId,
        email: input.email,
        role: input.role,
        tokenHash,
        invitedBy: actor.userId,
        expiresAt,
      });
      const emailId = await insertEmail(trx, {
        firmId: actor.firmId,
        to: input.email,
        purpose: 'invitation',
        ...invitationEmail({
          firmName: firm!.name,
          inviterName: inviter!.name,
          role: input.role,
          link,
          expiresAt,
          timeZone: firm!.time_zone,
        }),
      });
      const [invitation] = await listPendingInvitations(trx, actor.firmId, now, id);
      return { invitation: invitation!, emailId };
    }),
  );
  await deps.mailQueue.notify([emailId]);
  return invitation;
}

export async function withdrawInvitation(deps: AppDeps, actor: Actor, id: number): Promise<void> {
  ForbiddenError.from(actor.ability).throwUnlessCan('delete', 'Invitation');
  const changed = await deps.db.transaction((trx) => withdrawInvitationRow(trx, actor.firmId, id, deps.clock.now()));
  if (!changed) throw notFound('That invitation');
}

export async function previewInvitation(deps: AppDeps, token: string): Promise<InvitationPreview> {
  const inv = await findUsableInvitationByTokenHash(deps.db, hashToken(token), deps.clock.now());
  if (!inv) throw new HttpError(404, INVALID_LINK);
  const user = await findUserByEmail(deps.db, inv.email);
  return { firmName: inv.firm_name, email: inv.email, role: inv.role, accountExists: Boolean(user) };
}

function fieldError(path: string, message: string): HttpError {
  return new HttpError(422, message, 'ValidationFailed', [{ path, message }]);
}

/**
 * Accepts an invitation once: a new person sets a name and password; someone who already has
 * an account proves it with their password. Either way they join the firm and are signed in there.
 */
export async function acceptInvitation(
  deps: AppDeps,
  token: string,
  input: AcceptInvitationInput,
): Promise<{ userId: number; firmId: number }> {
  const now = deps.clock.now();
  const preview = await findUsableInvitationByTokenHash(deps.db, hashToken(token), now);
  if (!preview) throw new HttpError(404, INVALID_LINK);
  const existing = await findUserByEmail(deps.db, preview.email);
  let newAccount: { name: string; passwordHash: string } | undefined;
  if (existing) {
    if (!(await verifyPassword(existing.password_hash, input.password))) {
      throw fieldError('password', `That is not the password of the Heatfleet account ${preview.email}.`);
    }
  } else {
    const parsed = z.object({ name: personNameSchema, password: passwordSchema }).safeParse(input);
    if (!parsed.success) throw parsed.error;
    await assertPasswordAcceptable(parsed.data.password, preview.email);
    newAccount = { name: parsed.data.name, passwordHash: await hashPassword(parsed.data.password) };
  }
  return deps.db.transaction(async (trx) => {
    // Re-read under a lock: two tabs accepting the same link at once must not both succeed.
    const inv = await findUsableInvitationByTokenHash(trx, hashToken(token), now, { forUpdate: true });
    if (!inv) throw new HttpError(404, INVALID_LINK);
    const userId = existing?.id ?? (await insertUser(trx, { email: inv.email, ...newAccount! }));
    const member = await findMemberByUser(trx, inv.firm_id, userId);
    if (member?.active) throw conflict(`${inv.email} is already a member of ${inv.firm_name}.`);
    if (member) await updateMembership(trx, inv.firm_id, member.id, { role: inv.role, active: true });
    else await insertMembership(trx, { firmId: inv.firm_id, userId, role: inv.role });
    await markInvitationAccepted(trx, inv.firm_id, inv.id, now);
    return { userId, firmId: inv.firm_id };
  });
}
