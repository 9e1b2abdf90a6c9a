import type { Knex } from 'knex';
import type {
  ChangePasswordInput,
  Me,
  PasswordResetConfirmInput,
  SignInInput,
  SignUpInput,
} from '@heatfleet/domain';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { conflict, HttpError, notFound, ruleBroken, signedOut } from '../../lib/http-error.ts';
import { createToken, hashToken } from '../../lib/tokens.ts';
import { endSessionsOfUser } from '../../middleware/session.ts';
import { findFirm, insertFirm, setUpNewFirm } from '../firms/firm-dal.ts';
import { insertEmail } from '../mail/mail-dal.ts';
import { passwordResetEmail } from '../mail/mail-templates.ts';
import { findActiveMembership, insertMembership, listMembershipsOfUser } from '../members/member-dal.ts';
import { hashPassword, verifyAgainstDummy, verifyPassword } from './password.ts';
import { findUserByEmail, findUserById, insertUser, updatePasswordHash } from './user-dal.ts';

const PASSWORD_RESET_LIFETIME_MS = 60 * 60 * 1000;
const SIGN_IN_FAILED = 'E-mail or password is not right.';

export async function buildMe(db: Knex, userId: number, firmId: number): Promise<Me> {
  const [user, memberships, firm] = await Promise.all([findUserById(db, userId), listMembershipsOfUser(db, userId), findFirm(db, firmId)]);
  const active = memberships.find((m) => m.firmId === firmId);
  if (!user || !firm || !active) throw signedOut();
  return {
    user: { id: user.id, name: user.name, email: user.email },
    memberships,
    activeFirm: { id: firm.id, name: firm.name, timeZone: firm.time_zone },
    role: active.role,
    memberId: active.memberId,
  };
}

/**
 * Creates a firm with the person as its Owner. An existing account may create another firm
 * by giving its own password; anyone else using that e-mail is refused.
 */
export async function signUp(deps: AppDeps, input: SignUpInput): Promise<{ userId: number; firmId: number }> {
  const existing = await findUserByEmail(deps.db, input.email);
  if (existing && !(await verifyPassword(existing.password_hash, input.password))) {
    throw conflict(`An account for ${input.email} already exists. Sign in, or give that account's password to add a firm to it.`);
  }
  const passwordHash = existing ? null : await hashPassword(input.password);
  return deps.db.transaction(async (trx) => {
    const userId = existing?.id ?? (await insertUser(trx, { email: input.email, name: input.name, passwordHash: passwordHash! }));
    const firmId = await insertFirm(trx, { name: input.firmName });
    await insertMembership(trx, { firmId, userId, role: 'owner' });
    await setUpNewFirm(trx, firmId);
    return { userId, firmId };
  });
}

export async function signIn(deps: AppDeps, input: SignInInput): Promise<{ userId: number; firmId: number }> {
  const user = await findUserByEmail(deps.db, input.email);
  const ok = user ? await verifyPassword(user.password_hash, input.password) : await verifyAgainstDummy(input.password);
  if (!user || !ok) throw new HttpError(401, SIGN_IN_FAILED, 'SignInFailed');
  const memberships = await listMembershipsOfUser(deps.db, user.id);
  const first = memberships[0];
  if (!first) throw new HttpError(403, 'Your account is not an active member of any firm. Ask your firm\u2019s admin to invite you again.', 'NoActiveFirm');
  return { userId: user.id, firmId: first.firmId };
}

export async function setActiveFirm(deps: AppDeps, userId: number, firmId: number): Promise<void> {
  if (!(await findActiveMembership(deps.db, userId, firmId))) throw notFound('That firm');
}

/** Changes the password and ends every other session of the person. */
export async function changePassword(deps: AppDeps, actor: Actor, input: ChangePasswordInput, currentSid: string): Promise<void> {
  const user = await findUserById(deps.db, actor.userId);
  if (!user || !(await verifyPassword(user.password_hash, input.currentPassword))) {
    throw new HttpError(422, 'Your current password is not right.', 'ValidationFailed', [
      { path: 'currentPassword', message: 'Your current password is not right.' },
    ]);
  }
  const passwordHash = await hashPassword(input.newPassword);
  await updatePasswordHash(deps.db, actor.userId, passwordHash, deps.clock.now());
  await endSessionsOfUser(deps.db, actor.userId, currentSid);
}

/** Same answer whether or not the e-mail is known; only a known one gets a link. */
export async function requestPasswordReset(deps: AppDeps, email: string): Promise<void> {
  const user = await findUserByEmail(deps.db, email);
  if (!user) return;
  const { token, tokenHash } = createToken();
  const now = deps.clock.now();
  const link = new URL(`/reset-password/${token}`, deps.env.APP_ORIGIN).toString();
  const emailId = await deps.db.transaction(async (trx) => {
    await trx('password_resets').insert({ user_id: user.id, token_hash: tokenHash, expires_at: new Date(now.getTime() + PASSWORD_RESET_LIFETIME_MS) });
    return insertEmail(trx, { firmId: null, to: user.email, purpose: 'password-reset', ...passwordResetEmail({ name: user.name, link }) });
  });
  await deps.mailQueue.notify([emailId]);
}

export async function confirmPasswordReset(deps: AppDeps, input: PasswordResetConfirmInput): Promise<void> {
  const now = deps.clock.now();
  const passwordHash = await hashPassword(input.password);
  const userId = await deps.db.transaction(async (trx) => {
    const reset: { id: number; user_id: number; expires_at: Date; used_at: Date | null } | undefined = await trx('password_resets')
      .where({ token_hash: hashToken(input.token) })
      .forUpdate()
      .first();
    if (!reset || reset.used_at || reset.expires_at.getTime() <= now.getTime()) {
      throw ruleBroken('This reset link has expired or was already used. Ask for a new one.');
    }
    await trx('password_resets').where({ id: reset.id }).update({ used_at: now });
    await updatePasswordHash(trx, reset.user_id, passwordHash, now);
    return reset.user_id;
  });
  await endSessionsOfUser(deps.db, userId);
}
