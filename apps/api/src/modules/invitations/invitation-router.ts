import {
  acceptInvitationInputSchema,
  createInvitationInputSchema,
  idParamSchema,
  invitationListResponseSchema,
  invitationPreviewResponseSchema,
  invitationResponseSchema,
  invitationTokenParamSchema,
  sessionEnvelopeSchema,
} from '@heatfleet/domain';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { buildMe } from '../auth/auth-service.ts';
import { startSession } from '../auth/session-helpers.ts';
import {
  acceptInvitation,
  createInvitation,
  listInvitations,
  previewInvitation,
  withdrawInvitation,
} from './invitation-service.ts';

export const invitationRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get',
    path: '/invitations',
    tag: 'Team',
    access: 'member',
    tenantData: true,
    summary: 'Open invitations of the active firm (Owner, Admin)',
    request: {},
    responses: { 200: { description: 'Invitations', schema: invitationListResponseSchema } },
    handle: async ({ res, deps, actor }) => {
      res.json({ invitations: await listInvitations(deps, actor) });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/invitations',
    tag: 'Team',
    access: 'member',
    tenantData: true,
    summary: 'Invite someone by e-mail with a role; the link works once and expires in 7 days',
    request: { body: createInvitationInputSchema },
    responses: {
      201: { description: 'Invited', schema: invitationResponseSchema },
      409: { description: 'Already a member' },
      429: { description: 'Too many invitations sent' },
    },
    // Each invitation sends an e-mail: limited per person and per client address.
    before: (deps) => [deps.limiters.invitationByAddress, deps.limiters.invitationByAccount],
    handle: async ({ body, res, deps, actor }) => {
      res.status(201).json({ invitation: await createInvitation(deps, actor, body) });
    },
  }),
  defineRoute({
    method: 'delete',
    path: '/invitations/:id',
    tag: 'Team',
    access: 'member',
    tenantData: true,
    summary: 'Withdraw an open invitation',
    request: { params: idParamSchema },
    responses: { 204: { description: 'Withdrawn' }, 404: { description: 'No such open invitation in this firm' } },
    handle: async ({ params, res, deps, actor }) => {
      await withdrawInvitation(deps, actor, params.id);
      res.status(204).end();
    },
  }),
  defineRoute({
    method: 'get',
    path: '/invitations/by-token/:token',
    tag: 'Team',
    access: 'public',
    tenantData: false,
    summary: 'What an invitation link offers: firm, e-mail, role, and whether the account exists',
    request: { params: invitationTokenParamSchema },
    responses: {
      200: { description: 'Invitation', schema: invitationPreviewResponseSchema },
      404: { description: 'Invalid link' },
    },
    handle: async ({ params, res, deps }) => {
      res.json({ invitation: await previewInvitation(deps, params.token) });
    },
  }),
  defineRoute({
    method: 'post',
    path: '/invitations/by-token/:token/accept',
    tag: 'Team',
    access: 'public',
    tenantData: false,
    summary: 'Accept an invitation (new account, or join with an existing one) and sign in',
    request: { params: invitationTokenParamSchema, body: acceptInvitationInputSchema },
    responses: { 200: { description: 'Joined', schema: sessionEnvelopeSchema }, 404: { description: 'Invalid link' } },
    before: (deps) => [deps.limiters.linkByAddress, deps.limiters.linkByToken],
    handle: async ({ params, body, req, res, deps }) => {
      const { userId, firmId } = await acceptInvitation(deps, params.token, body);
      const csrfToken = await startSession(req, userId, firmId, deps.clock.now());
      res.json({ me: await buildMe(deps.db, userId, firmId), csrfToken });
    },
  }),
];
