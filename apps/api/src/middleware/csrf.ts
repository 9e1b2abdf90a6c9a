import type { RequestHandler } from 'express';
import { csrfSync } from 'csrf-sync';
import { HttpError } from '../lib/http-error.ts';

// OWASP's synchronizer token pattern: the token lives in the session and comes back in a header.
export const { csrfSynchronisedProtection: csrfProtection, generateToken: generateCsrfToken } = csrfSync({
  getTokenFromRequest: (req) => req.get('x-csrf-token') ?? undefined,
  errorConfig: { statusCode: 403, message: 'Invalid CSRF token.', code: 'EBADCSRFTOKEN' },
});

const unsafeMethods = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

const loopbackNames = new Set(['localhost', '127.0.0.1', '[::1]']);

function hostnameOf(hostHeader: string): string {
  // "name:port" or "[v6]:port"; the port does not matter here.
  const match = /^(\[[^\]]+\]|[^:]+)(?::\d+)?$/.exec(hostHeader.trim().toLowerCase());
  return match?.[1] ?? '';
}

/**
 * Refuses a state-changing request whose Origin is not the app's own (APP_ORIGIN). The request's
 * own Host is not trusted for this: an attacker chooses it. In development any loopback origin is
 * also accepted, as the dev server may be opened as localhost or 127.0.0.1.
 */
export function originCheck(appOrigin: string, nodeEnv: string): RequestHandler {
  const allowed = new URL(appOrigin).origin;
  return (req, _res, next) => {
    if (!unsafeMethods.has(req.method)) return next();
    const origin = req.get('origin');
    if (!origin || origin === allowed) return next();
    if (nodeEnv === 'development' && URL.canParse(origin) && loopbackNames.has(new URL(origin).hostname)) return next();
    next(new HttpError(403, 'This request came from another site and was refused.', 'ForeignOrigin'));
  };
}

/**
 * Answers only the host names the app is served as: APP_ORIGIN's, loopback, and ALLOWED_HOSTS.
 * A page on a name that an attacker points at this machine (DNS rebinding) gets 400. Off in
 * development, where the dev server's proxy may pass any name through.
 */
export function hostCheck(appOrigin: string, allowedHosts: string[], nodeEnv: string): RequestHandler {
  const allowed = new Set([new URL(appOrigin).hostname.toLowerCase(), ...loopbackNames, ...allowedHosts]);
  return (req, _res, next) => {
    if (nodeEnv === 'development') return next();
    const host = req.get('host');
    if (host && allowed.has(hostnameOf(host))) return next();
    next(new HttpError(400, 'This server does not answer to that host name.', 'UnknownHost'));
  };
}
