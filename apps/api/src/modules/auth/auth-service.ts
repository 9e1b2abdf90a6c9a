import type { Knex } from 'knex';
import type {
  ChangePasswordInput,
  CreateFirmInput,
  Me,
  PasswordResetConfirmInput,
  SignInInput,
  SignUpConfirmInput,
  SignUpInput,
} from '@heatfleet/domain';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { HttpError, notFound, ruleBroken, signedOut } from '../../lib/http-error.ts';
import { createToken, hashToken } from '../../lib/tokens.ts';
import { endSessionsOfUser } from './session-dal.ts';
import { findFirm, insertFirm, setUpNewFirm } from '../firms/firm-dal.ts';
import { insertEmail } from '../mail/mail-dal.ts';
import { passwordResetEmail, signUpConfirmEmail, signUpExistingAccountEmail } from '../mail/mail-templates.ts';
import { findActiveMembership, insertMembership, listMembershipsOfUser } from '../members/member-dal.ts';
import { assertPasswordAcceptable, hashPassword, verifyAgainstDummy, verifyPassword } from './password.ts';
import { endOpenPasswordResets, findPasswordResetForUpdate, insertPasswordReset } from './password-reset-dal.ts';
import { endSignUpRequests, findSignUpRequestForUpdate, insertSignUpRequest } from './sign-up-dal.ts';
import { findUserByEmail, findUserById, insertUser, updatePasswordHash } from './user-dal.ts';

const PASSWORD_RESET_LIFETIME_MS = 60 * 60 * 1000;
const SIGN_UP_LIFETIME_MS = 24 * 60 * 60 * 1000;
const SIGN_IN_FAILED = 'E-mail or password is not right.';

export async function buildMe(db: Knex, userId: number, firmId: number): Promise<Me> {
  const [user, memberships, firm] = await Promise.all([
    findUserById(db, userId),
    listMembershipsOfUser(db, userId),
    findFirm(db, firmId),
  ]);
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
 * Sign-up answers the same whether or not the address has an account, so it tells nobody which
 * addresses do: a new address gets a link that creates the firm; an address with an account gets an
 * e-mail saying someone tried (nobody is signed in, no password is checked). Both paths hash the
 * password, so they take about the same time.
 */
export async function requestSignUp(deps: AppDeps, input: SignUpInput): Promise<void> {
  await assertPasswordAcceptable(input.password, input.email);
  const passwordHash = await hashPassword(input.password);
  const existing = await findUserByEmail(deps.db, input.email);
  const now = deps.clock.now();
  const emailId = await deps.db.transaction(async (trx) => {
    // Both paths write one request row and one e-mail, so they cost the same: for an address that
    // already has an account the row is a record of the attempt, ended at once, and its link is never sent.
    const { token, tokenHash } = createToken();
    await insertSignUpRequest(trx, {
      email: input.email,
      name: input.name,
      firmName: input.firmName,
      passwordHash,
      tokenHash,
      expiresAt: new Date(now.getTime() + SIGN_UP_LIFETIME_MS),
      ...(existing ? { usedAt: now } : {}),
    });
    if (existing) {
      const signInLink = new URL('/sign-in', deps.env.APP_ORIGIN).toString();
      return insertEmail(trx, {
        firmId: null,
        to: existing.email,
        purpose: 'sign-up',
        ...signUpExistingAccountEmail({ name: existing.name, link: signInLink }),
      });
    }
    const link = new URL(`/sign-up/confirm/${token}`, deps.env.APP_ORIGIN).toString();
    return insertEmail(trx, {
      firmId: null,
      to: input.email,
      purpose: 'sign-up',
      ...signUpConfirmEmail({ name: input.name, firmName: input.firmName, link }),
    });
  });
  await deps.mailQueue.notify([emailId]);
}

/** Creates the account and its firm from a confirmed sign-up; the person becomes the firm's Owner. */
export async function confirmSignUp(
  deps: AppDeps,
  input: SignUpConfirmInput,
): Promise<{ userId: number; firmId: number }> {
  const now = deps.clock.now();
  return deps.db.transaction(async (trx) => {
    const request = await findSignUpRequestForUpdate(trx, hashToken(input.token));
    if (!request || request.used_at || request.expires_at.getTime() <= now.getTime()) {
      throw ruleBroken('This link has expired or was already used. Sign up again to get a new one.');
    }
    await endSignUpRequests(trx, request.email, now);
    if (await findUserByEmail(trx, request.email)) {
      throw ruleBroken('This e-mail address already has an account. Sign in, then create the firm from your account.');
    }
    const userId = await insertUser(trx, {
      email: request.email,
      name: request.name,
      passwordHash: request.password_hash,
    });
    const firmId = await createFirmFor(trx, userId, request.firm_name);
    return { userId, firmId };
  });
}

/** A signed-in person's further firm, with them as its Owner. */
export async function createFirmForActor(deps: AppDeps, userId: number, input: CreateFirmInput): Promise<number> {
  return deps.db.transaction((trx) => createFirmFor(trx, userId, input.firmName));
}

async function createFirmFor(trx: Knex.Transaction, userId: number, firmName: string): Promise<number> {
  const firmId = await insertFirm(trx, { name: firmName });
  await insertMembership(trx, { firmId, userId, role: 'owner' });
  await setUpNewFirm(trx, firmId);
  return firmId;
}

export async function signIn(deps: AppDeps, input: SignInInput): Promise<{ userId: number; firmId: number }> {
  const user = await findUserByEmail(deps.db, input.email);
  const ok = user ? await verifyPassword(user.password_hash, input.password) : await verifyAgainstDummy(input.password);
  if (!user || !ok) throw new HttpError(401, SIGN_IN_FAILED, 'SignInFailed');
  const memberships = await listMembershipsOfUser(deps.db, user.id);
  const first = memberships[0];
  if (!first)
    throw new HttpError(
      403,
      'Your account is not an active member of any firm. Ask your firm\u2019s admin to invite you again.',
      'NoActiveFirm',
    );
  return { userId: user.id, firmId: first.firmId };
}

export async function setActiveFirm(deps: AppDeps, userId: number, firmId: number): Promise<void> {
  if (!(await findActiveMembership(deps.db, userId, firmId))) throw notFound('That firm');
}

/** Changes the password and ends every other session of the person. */
export async function changePassword(
  deps: AppDeps,
  actor: Actor,
  input: ChangePasswordInput,
  currentSid: string,
): Promise<void> {
  const user = await findUserById(deps.db, actor.userId);
  if (!user || !(await verifyPassword(user.password_hash, input.currentPassword))) {
    throw new HttpError(422, 'Your current password is not right.', 'ValidationFailed', [
      { path: 'currentPassword', message: 'Your current password is not right.' },
    ]);
  }
  await assertPasswordAcceptable(input.newPassword, user.email, 'newPassword');
  const passwordHash = await hashPassword(input.newPassword);
  const now = deps.clock.now();
  await deps.db.transaction(async (trx) => {
    await updatePasswordHash(trx, actor.userId, passwordHash, now);
    await endOpenPasswordResets(trx, actor.userId, now);
  });
  await endSessionsOfUser(deps.db, actor.userId, currentSid);
}

/** Same answer whether or not the e-mail is known; only a known one gets a link, and earlier links end. */
export async function requestPasswordReset(deps: AppDeps, email: string): Promise<void> {
  const user = await findUserByEmail(deps.db, email);
  if (!user) return;
  const { token, tokenHash } = createToken();
  const now = deps.clock.now();
  const link = new URL(`/reset-password/${token}`, deps.env.APP_ORIGIN).toString();
  const emailId = await deps.db.transaction(async (trx) => {
    await endOpenPasswordResets(trx, user.id, now);
    await insertPasswordReset(trx, {
      userId: user.id,
      tokenHash,
      expiresAt: new Date(now.getTime() + PASSWORD_RESET_LIFETIME_MS),
    });
    return insertEmail(trx, {
      firmId: null,
      to: user.email,
      purpose: 'password-reset',
      ...passwordResetEmail({ name: user.name, link }),
    });
  });
  await deps.mailQueue.notify([emailId]);
}

export async function confirmPasswordReset(deps: AppDeps, input: PasswordResetConfirmInput): Promise<void> {
  const now = deps.clock.now();
  const userId = await deps.db.transaction(async (trx) => {
    const reset = await findPasswordResetForUpdate(trx, hashToken(input.token));
    if (!reset || reset.used_at || reset.expires_at.getTime() <= now.getTime()) {
      throw ruleBroken('This reset link has expired or was already used. Ask for a new one.');
    }
    const user = await findUserById(trx, reset.user_id);
    await assertPasswordAcceptable(input.password, user?.email ?? null);
    await updatePasswordHash(trx, reset.user_id, await hashPassword(input.password), now);
    // Every link of the account ends with this one, not just the one used.
    await endOpenPasswordResets(trx, reset.user_id, now);
    return reset.user_id;
  });
  await endSessionsOfUser(deps.db, userId);
}
