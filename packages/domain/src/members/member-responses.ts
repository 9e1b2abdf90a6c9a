import { z } from 'zod';
import { meResponseSchema } from '../auth/auth-schemas.ts';
import { invitationPreviewSchema, invitationSchema, memberSchema } from './member-schemas.ts';

// The success bodies of the team routes (members and invitations): the API declares them, the
// client's queries parse with them.

export const memberListResponseSchema = z.object({ members: z.array(memberSchema) });
export const memberResponseSchema = z.object({ member: memberSchema });

export const invitationListResponseSchema = z.object({ invitations: z.array(invitationSchema) });
export const invitationResponseSchema = z.object({ invitation: invitationSchema });
export const invitationPreviewResponseSchema = z.object({ invitation: invitationPreviewSchema });

/** Accepting an invitation signs the person in: who they are now, and the new session's CSRF token. */
export const invitationAcceptedResponseSchema = z.object({ me: meResponseSchema, csrfToken: z.string() });
export type InvitationAcceptedResponse = z.infer<typeof invitationAcceptedResponseSchema>;
