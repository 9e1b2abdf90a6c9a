import type { RouteDefinition } from '@heatfleet/api/routes/route-registry.ts';
import type { SeededFirm } from './seed-firm.ts';
import { uniqueEmail } from './test-app.ts';

export const routeKey = (r: Pick<RouteDefinition, 'method' | 'path'>) => `${r.method.toUpperCase()} ${r.path}`;

/**
 * How to fill each path parameter from a seeded firm, by the resource the path names.
 * A new route with a parameter the harness cannot fill fails the tests until it is added here.
 */
const pathIds: Record<string, (f: SeededFirm) => string> = {
  'members:id': (f) => String(f.target.memberId),
  'invitations:id': (f) => String(f.invitation.id),
  'invitations:token': (f) => f.invitation.token,
  'outbox:id': () => 'does-not-exist',
};

/** A valid body per route, built from a firm's records (so another firm's ids can be slipped in). */
const bodies: Record<string, (f: SeededFirm) => unknown> = {
  'POST /auth/sign-up': () => ({ firmName: 'Probe firm', name: 'Probe', email: uniqueEmail('probe'), password: 'probe password 123' }),
  'POST /auth/sign-in': (f) => ({ email: f.people.engineer.email, password: 'wrong password probe' }),
  'POST /auth/password-reset': (f) => ({ email: f.people.engineer.email }),
  'POST /auth/password-reset/confirm': () => ({ token: 'x'.repeat(43), password: 'probe password 123' }),
  'PUT /me/active-firm': (f) => ({ firmId: f.firmId }),
  'PUT /me/password': () => ({ currentPassword: 'not the current one', newPassword: 'probe password 123' }),
  'PATCH /members/:id': () => ({ role: 'stores' }),
  'POST /invitations': () => ({ email: uniqueEmail('probe-invitee'), role: 'engineer' }),
  'POST /invitations/by-token/:token/accept': () => ({ password: 'probe password 123', name: 'Probe' }),
};

export function probePath(route: RouteDefinition, firm: SeededFirm): string {
  const resource = route.path.split('/')[1] ?? '';
  return `/api${route.path.replace(/:([A-Za-z]+)/g, (_m, name: string) => {
    const fill = pathIds[`${resource}:${name}`];
    if (!fill) throw new Error(`The isolation harness does not know how to fill ${name} in ${routeKey(route)}: add it to route-probes.ts`);
    return encodeURIComponent(fill(firm));
  })}`;
}

export function probeBody(route: RouteDefinition, firm: SeededFirm): unknown {
  if (!route.request.body) return undefined;
  const build = bodies[routeKey(route)];
  if (!build) throw new Error(`The isolation harness has no sample body for ${routeKey(route)}: add one to route-probes.ts`);
  return build(firm);
}
