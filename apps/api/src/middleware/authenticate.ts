import type { Request } from 'express';
import type { Actor, AppDeps } from '../app-deps.ts';
import { signedOut } from '../lib/http-error.ts';
import { findActiveMembership } from '../modules/members/member-dal.ts';
import { abilityFor } from './ability-cache.ts';

// Writing lastSeenAt on every request would turn every read into a session write.
const LAST_SEEN_GRANULARITY_MS = 60 * 1000;

function destroy(req: Request): Promise<void> {
  return new Promise((resolve, reject) => req.session.destroy((err) => (err ? reject(err) : resolve())));
}

/**
 * Resolves the signed-in member in the session's active firm, enforcing the idle timeout and
 * absolute lifetime on the server (the cookie's own expiry is only a hint to the browser).
 */
export async function authenticate(req: Request, deps: AppDeps): Promise<Actor> {
  const s = req.session;
  if (!s.userId || !s.firmId || !s.signedInAt || !s.lastSeenAt) throw signedOut();
  const now = deps.clock.now().getTime();
  const idleMs = deps.env.SESSION_IDLE_MINUTES * 60 * 1000;
  const absoluteMs = deps.env.SESSION_ABSOLUTE_HOURS * 60 * 60 * 1000;
  if (now - s.lastSeenAt > idleMs || now - s.signedInAt > absoluteMs) {
    await destroy(req);
    throw signedOut('Your session has ended. Please sign in again.');
  }
  // Read with the session in one query (session.ts); a session made during this request has none yet.
  const membership =
    s.loadedMembership !== undefined ? s.loadedMembership : await findActiveMembership(deps.db, s.userId, s.firmId);
  if (!membership) {
    await destroy(req);
    throw signedOut('You are no longer a member of that firm. Please sign in again.');
  }
  if (now - s.lastSeenAt > LAST_SEEN_GRANULARITY_MS) s.lastSeenAt = now;
  return {
    userId: s.userId,
    firmId: s.firmId,
    memberId: membership.id,
    role: membership.role,
    ability: abilityFor({ userId: s.userId, firmId: s.firmId, role: membership.role, memberId: membership.id }),
  };
}
