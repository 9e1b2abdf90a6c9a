import { z } from 'zod';
import { invitationPreviewSchema, invitationSchema, memberSchema } from './member-schemas.ts';

// The success bodies of the team routes (members and invitations): the API declares them, the
// client's queries parse with them. Accepting an invitation answers with auth's sessionEnvelopeSchema.

export const memberListResponseSchema = z.object({ members: z.array(memberSchema) });
export const memberResponseSchema = z.object({ member: memberSchema });

export const invitationListResponseSchema = z.object({ invitations: z.array(invitationSchema) });
export const invitationResponseSchema = z.object({ invitation: invitationSchema });
export const invitationPreviewResponseSchema = z.object({ invitation: invitationPreviewSchema });
