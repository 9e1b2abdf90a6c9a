import { z } from 'zod';
import { roleSchema } from '../permissions/roles.ts';
import { emailSchema, personNameSchema, passwordSchema, tokenSchema } from '../auth/auth-schemas.ts';

export const idParamSchema = z.strictObject({
  id: z.coerce
    .number({ error: 'The id must be a number.' })
    .int({ error: 'The id must be a whole number.' })
    .positive({ error: 'The id must be positive.' })
    .max(2 ** 53 - 1),
});

export const memberSchema = z.object({
  id: z.number(),
  userId: z.number(),
  name: z.string(),
  email: z.string(),
  role: roleSchema,
  active: z.boolean(),
  joinedAt: z.string(),
});
export type Member = z.infer<typeof memberSchema>;

export const updateMemberInputSchema = z
  .strictObject({
    role: roleSchema.optional(),
    active: z.boolean({ error: 'Active must be true or false.' }).optional(),
  })
  .refine((v) => v.role !== undefined || v.active !== undefined, {
    error: 'Send a role or an active flag to change.',
  });
export type UpdateMemberInput = z.infer<typeof updateMemberInputSchema>;

export const createInvitationInputSchema = z.strictObject({
  email: emailSchema,
  role: roleSchema,
});
export type CreateInvitationInput = z.infer<typeof createInvitationInputSchema>;

export const invitationSchema = z.object({
  id: z.number(),
  email: z.string(),
  role: roleSchema,
  invitedBy: z.string(),
  expiresAt: z.string(),
  acceptedAt: z.string().nullable(),
  createdAt: z.string(),
});
export type Invitation = z.infer<typeof invitationSchema>;

/** What the invitee sees before accepting: enough to decide, nothing more. */
export const invitationPreviewSchema = z.object({
  firmName: z.string(),
  email: z.string(),
  role: roleSchema,
  accountExists: z.boolean(),
});
export type InvitationPreview = z.infer<typeof invitationPreviewSchema>;

export const invitationTokenParamSchema = z.strictObject({ token: tokenSchema });

// A new account gives a name and password; an existing account gives its password to prove it is theirs.
export const acceptInvitationInputSchema = z.strictObject({
  name: personNameSchema.optional(),
  password: z.string({ error: 'Password is required.' }).min(1, { error: 'Password is required.' }).max(512),
});
export type AcceptInvitationInput = z.infer<typeof acceptInvitationInputSchema>;
export { passwordSchema };
