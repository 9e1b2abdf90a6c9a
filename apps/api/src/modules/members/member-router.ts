import {
  idParamSchema,
  memberListResponseSchema,
  memberResponseSchema,
  updateMemberInputSchema,
} from '@heatfleet/domain';
import { defineRoute, type RouteDefinition } from '../../routes/route-registry.ts';
import { listMembers, updateMember } from './member-service.ts';

export const memberRoutes: RouteDefinition[] = [
  defineRoute({
    method: 'get',
    path: '/members',
    tag: 'Team',
    access: 'member',
    tenantData: true,
    summary: 'Members of the active firm',
    request: {},
    responses: { 200: { description: 'Members', schema: memberListResponseSchema } },
    handle: async ({ res, deps, actor }) => {
      res.json({ members: await listMembers(deps, actor) });
    },
  }),
  defineRoute({
    method: 'patch',
    path: '/members/:id',
    tag: 'Team',
    access: 'member',
    tenantData: true,
    summary: 'Change a member\u2019s role, or deactivate or reactivate them (Owner, Admin)',
    request: { params: idParamSchema, body: updateMemberInputSchema },
    responses: {
      200: { description: 'Updated', schema: memberResponseSchema },
      400: { description: 'Would leave the firm without an Owner' },
      404: { description: 'No such member in this firm' },
    },
    handle: async ({ params, body, res, deps, actor }) => {
      res.json({ member: await updateMember(deps, actor, params.id, body) });
    },
  }),
];
