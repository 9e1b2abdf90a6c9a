import { z } from 'zod';
import { roleSchema } from '../permissions/roles.ts';
import { singleLineName } from '../lib/text.ts';

export const PASSWORD_MIN_LENGTH = 12;
export const PASSWORD_MAX_LENGTH = 128;

export const emailSchema = z
  .string({ error: 'E-mail is required.' })
  .trim()
  .toLowerCase()
  .max(254, { error: 'E-mail must be at most 254 characters.' })
  .pipe(z.email({ error: (iss) => `"${String(iss.input)}" is not an e-mail address.` }));

// No composition rules (NIST SP 800-63B; OWASP): length alone, and no trimming of what the user typed.
export const passwordSchema = z
  .string({ error: 'Password is required.' })
  .min(PASSWORD_MIN_LENGTH, { error: `Password must be at least ${PASSWORD_MIN_LENGTH} characters.` })
  .max(PASSWORD_MAX_LENGTH, { error: `Password must be at most ${PASSWORD_MAX_LENGTH} characters.` });

export const personNameSchema = singleLineName('Name', { max: 120 });

export const firmNameSchema = singleLineName('Firm name', { min: 2, max: 120 });

/**
 * What makes a password easy to guess from who its owner is (NIST SP 800-63B, 5.1.1.2: refuse
 * context-specific words such as the username, and repetitive characters). The API also refuses
 * passwords on a published list of common and breached ones. Null when there is nothing to say.
 */
export function passwordContextProblem(password: string, email: string | null): string | null {
  const lower = password.trim().toLowerCase();
  if (/^(.)\1*$/su.test(lower)) return 'Password must not be one character repeated.';
  if (email) {
    const address = email.trim().toLowerCase();
    const local = address.split('@')[0] ?? '';
    if (lower === address || (local.length > 0 && lower === local))
      return 'Password must not be your e-mail address or its first part.';
  }
  if (lower === 'heatfleet' || /^heatfleet\d*$/u.test(lower)) return 'Password must not be the name of this service.';
  return null;
}

export const signUpInputSchema = z
  .strictObject({
    firmName: firmNameSchema,
    name: personNameSchema,
    email: emailSchema,
    password: passwordSchema,
  })
  .superRefine((input, ctx) => {
    const problem = passwordContextProblem(input.password, input.email);
    if (problem) ctx.addIssue({ code: 'custom', path: ['password'], message: problem });
  });
export type SignUpInput = z.infer<typeof signUpInputSchema>;

export const signInInputSchema = z.strictObject({
  email: emailSchema,
  // Any length is accepted at sign-in so an old password is still checked, but bounded to keep hashing cheap.
  password: z
    .string({ error: 'Password is required.' })
    .min(1, { error: 'Password is required.' })
    .max(PASSWORD_MAX_LENGTH * 4),
});
export type SignInInput = z.infer<typeof signInInputSchema>;

export const tokenSchema = z
  .string({ error: 'The link is incomplete.' })
  .trim()
  .regex(/^[A-Za-z0-9_-]{20,128}$/, { error: 'The link is not valid.' });

export const passwordResetRequestSchema = z.strictObject({ email: emailSchema });
export const passwordResetConfirmSchema = z.strictObject({ token: tokenSchema, password: passwordSchema });
export type PasswordResetConfirmInput = z.infer<typeof passwordResetConfirmSchema>;

export const changePasswordInputSchema = z.strictObject({
  currentPassword: z
    .string({ error: 'Current password is required.' })
    .min(1)
    .max(PASSWORD_MAX_LENGTH * 4),
  newPassword: passwordSchema,
});
export type ChangePasswordInput = z.infer<typeof changePasswordInputSchema>;

/** Confirms a sign-up with the token from its e-mail. */
export const signUpConfirmSchema = z.strictObject({ token: tokenSchema });
export type SignUpConfirmInput = z.infer<typeof signUpConfirmSchema>;

/** A signed-in person creates a further firm from their account. */
export const createFirmInputSchema = z.strictObject({ firmName: firmNameSchema });
export type CreateFirmInput = z.infer<typeof createFirmInputSchema>;

export const setActiveFirmInputSchema = z.strictObject({
  firmId: z.number({ error: 'Firm is required.' }).int().positive(),
});

export const csrfResponseSchema = z.object({ csrfToken: z.string() });

export const userSchema = z.object({ id: z.number(), name: z.string(), email: z.string() });
export const membershipSchema = z.object({
  memberId: z.number(),
  firmId: z.number(),
  firmName: z.string(),
  role: roleSchema,
});
export const meResponseSchema = z.object({
  user: userSchema,
  memberships: z.array(membershipSchema),
  activeFirm: z.object({ id: z.number(), name: z.string(), timeZone: z.string() }),
  role: roleSchema,
  /** The person's membership in the active firm (rules such as "their own van" use it). */
  memberId: z.number(),
});
export type Me = z.infer<typeof meResponseSchema>;
export type Membership = z.infer<typeof membershipSchema>;

/** `{ me }`: who is signed in. */
export const meEnvelopeSchema = z.object({ me: meResponseSchema });
/** What starts a session (sign-in, a confirmed sign-up, an accepted invitation, a password change): who, and the new CSRF token. */
export const sessionEnvelopeSchema = z.object({ me: meResponseSchema, csrfToken: z.string() });
export type SessionEnvelope = z.infer<typeof sessionEnvelopeSchema>;
/** A sentence for the person, when there is nothing else to say (a request accepted, a password changed). */
export const messageResponseSchema = z.object({ message: z.string() });
