import type { RequestHandler } from 'express';
import { csrfSync } from 'csrf-sync';
import { HttpError } from '../lib/http-error.ts';

// OWASP's synchronizer token pattern: the token lives in the session and comes back in a header.
export const { csrfSynchronisedProtection: csrfProtection, generateToken: generateCsrfToken } = csrfSync({
  getTokenFromRequest: (req) => req.get('x-csrf-token') ?? undefined,
  errorConfig: { statusCode: 403, message: 'Invalid CSRF token.', code: 'EBADCSRFTOKEN' },
});

const unsafeMethods = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/** Refuses a state-changing request whose Origin is neither the app's nor the request's own host. */
export function originCheck(appOrigin: string): RequestHandler {
  const allowed = new URL(appOrigin).origin;
  return (req, _res, next) => {
    if (!unsafeMethods.has(req.method)) return next();
    const origin = req.get('origin');
    if (!origin) return next();
    const own = `${req.protocol}://${req.get('host') ?? ''}`;
    if (origin === allowed || origin === own) return next();
    next(new HttpError(403, 'This request came from another site and was refused.', 'ForeignOrigin'));
  };
}
