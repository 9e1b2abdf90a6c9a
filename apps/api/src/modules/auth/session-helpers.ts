import type { Request } from 'express';
import { generateCsrfToken } from '../../middleware/csrf.ts';

function regenerate(req: Request): Promise<void> {
  return new Promise((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
}

export function saveSession(req: Request): Promise<void> {
  return new Promise((resolve, reject) => req.session.save((err) => (err ? reject(err) : resolve())));
}

/** Starts a fresh session (new id, so a planted one is useless) and returns its CSRF token. */
export async function startSession(req: Request, userId: number, firmId: number, now: Date): Promise<string> {
  await regenerate(req);
  req.session.userId = userId;
  req.session.firmId = firmId;
  req.session.signedInAt = now.getTime();
  req.session.lastSeenAt = now.getTime();
  const csrfToken = generateCsrfToken(req, true);
  await saveSession(req);
  return csrfToken;
}

export function endSession(req: Request): Promise<void> {
  return new Promise((resolve, reject) => req.session.destroy((err) => (err ? reject(err) : resolve())));
}
