import { z } from 'zod';
import { roleSchema } from '../permissions/roles.ts';

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

export const personNameSchema = z
  .string({ error: 'Name is required.' })
  .trim()
  .min(1, { error: 'Name is required.' })
  .max(120, { error: 'Name must be at most 120 characters.' });

export const firmNameSchema = z
  .string({ error: 'Firm name is required.' })
  .trim()
  .min(2, { error: 'Firm name must be at least 2 characters.' })
  .max(120, { error: 'Firm name must be at most 120 characters.' });

export const signUpInputSchema = z.strictObject({
  firmName: firmNameSchema,
  name: personNameSchema,
  email: emailSchema,
  password: passwordSchema,
});
export type SignUpInput = z.infer<typeof signUpInputSchema>;

export const signInInputSchema = z.strictObject({
  email: emailSchema,
  // Any length is accepted at sign-in so an old password is still checked, but bounded to keep hashing cheap.
  password: z.string({ error: 'Password is required.' }).min(1, { error: 'Password is required.' }).max(PASSWORD_MAX_LENGTH * 4),
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
  currentPassword: z.string({ error: 'Current password is required.' }).min(1).max(PASSWORD_MAX_LENGTH * 4),
  newPassword: passwordSchema,
});
export type ChangePasswordInput = z.infer<typeof changePasswordInputSchema>;

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
