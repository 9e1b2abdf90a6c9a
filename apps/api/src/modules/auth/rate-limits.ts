import type { Request, RequestHandler, Response } from 'express';
import { rateLimit, ipKeyGenerator, type Options, type Store } from 'express-rate-limit';
import { HttpError } from '../../lib/http-error.ts';

/**
 * Every route that takes a secret (a password, a link's token) or sends an e-mail is limited twice:
 * per account (or per link) whichever address it comes from, and per client address whichever
 * accounts it tries (OWASP Authentication Cheat Sheet, "Protect against automated attacks").
 * Limits are sliding windows, never permanent locks: hammering a victim's account delays the victim
 * by at most one window, and they can reset their password meanwhile.
 */
export interface RateLimits {
  windowMs: number;
  /** Failed sign-ins per account, and per client address. */
  perAccount: number;
  perAddress: number;
  /** Password-reset e-mails per address asked for (per hour), and requests per client address (per hour). */
  resetsPerAccount: number;
  resetsPerAddress: number;
  /** Sign-ups (each sends an e-mail) per e-mail address and per client address, per hour. */
  signUpsPerAccount: number;
  signUpsPerAddress: number;
  /** Failed uses of a link (sign-up confirmation, password reset, invitation) per link and per client address. */
  linkFailuresPerLink: number;
  linkFailuresPerAddress: number;
  /** Invitation e-mails sent, per signed-in person and per client address, per hour. */
  invitationsPerAccount: number;
  invitationsPerAddress: number;
  /** Wrong current passwords at a password change, per account and per client address. */
  passwordChangeFailuresPerAccount: number;
  passwordChangeFailuresPerAddress: number;
}

export const defaultRateLimits: RateLimits = {
  windowMs: 15 * 60 * 1000,
  perAccount: 10,
  perAddress: 50,
  resetsPerAccount: 5,
  resetsPerAddress: 20,
  signUpsPerAccount: 5,
  signUpsPerAddress: 20,
  linkFailuresPerLink: 5,
  linkFailuresPerAddress: 20,
  invitationsPerAccount: 50,
  invitationsPerAddress: 200,
  passwordChangeFailuresPerAccount: 5,
  passwordChangeFailuresPerAddress: 20,
};

export interface RateLimiters {
  signInByAccount: RequestHandler;
  signInByAddress: RequestHandler;
  signUpByAccount: RequestHandler;
  signUpByAddress: RequestHandler;
  resetRequestByAccount: RequestHandler;
  resetRequestByAddress: RequestHandler;
  /** Sign-up confirmation, password-reset confirmation and invitation acceptance: failures per link. */
  linkByToken: RequestHandler;
  linkByAddress: RequestHandler;
  passwordChangeByAccount: RequestHandler;
  passwordChangeByAddress: RequestHandler;
  invitationByAccount: RequestHandler;
  invitationByAddress: RequestHandler;
}

const HOUR_MS = 60 * 60 * 1000;

function bodyString(req: Request, field: string): string | undefined {
  const value: unknown = (req.body as Record<string, unknown> | undefined)?.[field];
  return typeof value === 'string' ? value : undefined;
}

function emailKey(req: Request): string {
  const email = bodyString(req, 'email');
  return email ? `account:${email.trim().toLowerCase().slice(0, 254)}` : 'account:(none)';
}

/** The link's token, from the body (confirmations) or the path (/invitations/:token/accept). */
function tokenKey(req: Request): string {
  const token = bodyString(req, 'token') ?? (req.params as Record<string, string | undefined>).token;
  return `link:${(token ?? '(none)').slice(0, 128)}`;
}

function addressKey(req: Request): string {
  return `address:${ipKeyGenerator(req.ip ?? '0.0.0.0')}`;
}

function signedInUserKey(_req: Request, res: Response): string {
  const actor = res.locals.actor as { userId?: number } | undefined;
  return `user:${actor?.userId ?? '(none)'}`;
}

function tooMany(message: string): Options['handler'] {
  return (req, _res, next) => {
    const resetTime = (req as Request & { rateLimit?: { resetTime?: Date } }).rateLimit?.resetTime;
    const seconds = resetTime ? Math.max(1, Math.ceil((resetTime.getTime() - Date.now()) / 1000)) : 60;
    next(
      new HttpError(
        429,
        `${message} Try again in ${Math.ceil(seconds / 60)} minute(s).`,
        'TooManyRequests',
        undefined,
        {
          'Retry-After': String(seconds),
        },
      ),
    );
  };
}

/** Where a limiter keeps its counts, by the limiter's name (each limiter needs a store of its own). */
export type LimitStoreFactory = (name: keyof RateLimiters) => Store;

function limiter(opts: {
  store?: Store;
  windowMs: number;
  limit: number;
  key: (req: Request, res: Response) => string;
  message: string;
  failuresOnly: boolean;
}): RequestHandler {
  return rateLimit({
    ...(opts.store !== undefined && { store: opts.store }),
    windowMs: opts.windowMs,
    limit: opts.limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: opts.key,
    handler: tooMany(opts.message),
    // Failures only: a person who gets it right is never slowed down by their own successes.
    skipSuccessfulRequests: opts.failuresOnly,
    requestWasSuccessful: (_req: Request, res: { statusCode: number }) => res.statusCode < 400,
  });
}

/**
 * Without a store factory the counts live in this process's memory (one replica only); create-deps.ts passes
 * one that keeps them on the shared Redis.
 */
export function createRateLimiters(overrides: Partial<RateLimits> = {}, storeFor?: LimitStoreFactory): RateLimiters {
  const l = { ...defaultRateLimits, ...overrides };
  const w = l.windowMs;
  return {
    signInByAccount: limiter({
      store: storeFor?.('signInByAccount'),
      windowMs: w,
      limit: l.perAccount,
      key: emailKey,
      failuresOnly: true,
      message: 'Too many failed sign-ins for this account.',
    }),
    signInByAddress: limiter({
      store: storeFor?.('signInByAddress'),
      windowMs: w,
      limit: l.perAddress,
      key: addressKey,
      failuresOnly: true,
      message: 'Too many failed sign-ins from this network.',
    }),
    signUpByAccount: limiter({
      store: storeFor?.('signUpByAccount'),
      windowMs: HOUR_MS,
      limit: l.signUpsPerAccount,
      key: emailKey,
      failuresOnly: false,
      message: 'Too many sign-ups for this e-mail address.',
    }),
    signUpByAddress: limiter({
      store: storeFor?.('signUpByAddress'),
      windowMs: HOUR_MS,
      limit: l.signUpsPerAddress,
      key: addressKey,
      failuresOnly: false,
      message: 'Too many sign-ups from this network.',
    }),
    resetRequestByAccount: limiter({
      store: storeFor?.('resetRequestByAccount'),
      windowMs: HOUR_MS,
      limit: l.resetsPerAccount,
      key: emailKey,
      failuresOnly: false,
      message: 'Too many password-reset e-mails asked for this address.',
    }),
    resetRequestByAddress: limiter({
      store: storeFor?.('resetRequestByAddress'),
      windowMs: HOUR_MS,
      limit: l.resetsPerAddress,
      key: addressKey,
      failuresOnly: false,
      message: 'Too many password-reset e-mails asked from this network.',
    }),
    linkByToken: limiter({
      store: storeFor?.('linkByToken'),
      windowMs: w,
      limit: l.linkFailuresPerLink,
      key: tokenKey,
      failuresOnly: true,
      message: 'Too many failed tries with this link.',
    }),
    linkByAddress: limiter({
      store: storeFor?.('linkByAddress'),
      windowMs: w,
      limit: l.linkFailuresPerAddress,
      key: addressKey,
      failuresOnly: true,
      message: 'Too many failed tries with links from this network.',
    }),
    passwordChangeByAccount: limiter({
      store: storeFor?.('passwordChangeByAccount'),
      windowMs: w,
      limit: l.passwordChangeFailuresPerAccount,
      key: signedInUserKey,
      failuresOnly: true,
      message: 'Too many wrong current passwords.',
    }),
    passwordChangeByAddress: limiter({
      store: storeFor?.('passwordChangeByAddress'),
      windowMs: w,
      limit: l.passwordChangeFailuresPerAddress,
      key: addressKey,
      failuresOnly: true,
      message: 'Too many wrong current passwords from this network.',
    }),
    invitationByAccount: limiter({
      store: storeFor?.('invitationByAccount'),
      windowMs: HOUR_MS,
      limit: l.invitationsPerAccount,
      key: signedInUserKey,
      failuresOnly: false,
      message: 'Too many invitations sent from your account.',
    }),
    invitationByAddress: limiter({
      store: storeFor?.('invitationByAddress'),
      windowMs: HOUR_MS,
      limit: l.invitationsPerAddress,
      key: addressKey,
      failuresOnly: false,
      message: 'Too many invitations sent from this network.',
    }),
  };
}
