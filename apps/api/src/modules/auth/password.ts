import argon2 from 'argon2';
import { passwordContextProblem } from '@heatfleet/domain';
import { HttpError } from '../../lib/http-error.ts';

// OWASP Password Storage Cheat Sheet's minimum for argon2id: m=19 MiB, t=2, p=1.
export const passwordHashOptions = {
  type: argon2.argon2id,
  memoryCost: 19 * 1024,
  timeCost: 2,
  parallelism: 1,
} as const;

export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, passwordHashOptions);
}

export async function verifyPassword(hash: string, password: string): Promise<boolean> {
  try {
    return await argon2.verify(hash, password);
  } catch {
    return false;
  }
}

let dummyHash: Promise<string> | undefined;
/** Spends the same work as a real check, so an unknown e-mail answers no faster than a wrong password. */
export async function verifyAgainstDummy(password: string): Promise<false> {
  dummyHash ??= hashPassword('heatfleet-timing-equaliser');
  await verifyPassword(await dummyHash, password);
  return false;
}

let commonPasswords: Set<string> | undefined;
/**
 * The common and breached passwords of @zxcvbn-ts/language-common (its "passwords-common" list,
 * about 49,000 entries gathered from published breach corpora), checked case-insensitively
 * (NIST SP 800-63B 5.1.1.2: refuse values from previous breach corpora).
 */
async function isCommonPassword(password: string): Promise<boolean> {
  if (!commonPasswords) {
    const { dictionary } = await import('@zxcvbn-ts/language-common');
    commonPasswords = new Set((dictionary as unknown as Record<string, string[]>)['passwords-common']);
  }
  return commonPasswords.has(password.toLowerCase());
}

/**
 * Refuses a new password that is easy to guess: on the common list, or built from the person's own
 * e-mail (the domain's passwordContextProblem). `field` names the form field for the error.
 */
export async function assertPasswordAcceptable(
  password: string,
  email: string | null,
  field = 'password',
): Promise<void> {
  const problem =
    passwordContextProblem(password, email) ??
    ((await isCommonPassword(password))
      ? 'That password is on a published list of common or breached passwords. Choose another.'
      : null);
  if (problem) throw new HttpError(422, problem, 'ValidationFailed', [{ path: field, message: problem }]);
}
