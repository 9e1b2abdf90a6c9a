import type { Request, RequestHandler } from 'express';
import { rateLimit, ipKeyGenerator, type Options } from 'express-rate-limit';
import { HttpError } from '../../lib/http-error.ts';

export interface SignInLimiter {
  /** Failed sign-ins per account (e-mail), whichever address they come from. */
  byAccount: RequestHandler;
  /** Failed sign-ins per client address, whichever accounts they try. */
  byAddress: RequestHandler;
  /** Password-reset e-mails per address asked for, so nobody floods an inbox. */
  passwordResetByAccount: RequestHandler;
}

export interface SignInLimits {
  windowMs: number;
  perAccount: number;
  perAddress: number;
  resetsPerAccount: number;
}

// The lock is a sliding window, never permanent: an attacker hammering a victim's account
// delays the victim by at most one window, and the victim can reset their password meanwhile.
export const defaultSignInLimits: SignInLimits = {
  windowMs: 15 * 60 * 1000,
  perAccount: 10,
  perAddress: 50,
  resetsPerAccount: 5,
};

function emailKey(req: Request): string {
  const email: unknown = (req.body as { email?: unknown } | undefined)?.email;
  return typeof email === 'string' ? `account:${email.trim().toLowerCase().slice(0, 254)}` : 'account:(none)';
}

function tooMany(message: string): Options['handler'] {
  return (req, _res, next) => {
    const resetTime = (req as Request & { rateLimit?: { resetTime?: Date } }).rateLimit?.resetTime;
    const seconds = resetTime ? Math.max(1, Math.ceil((resetTime.getTime() - Date.now()) / 1000)) : 60;
    next(new HttpError(429, `${message} Try again in ${Math.ceil(seconds / 60)} minute(s).`, 'TooManyRequests', undefined, {
      'Retry-After': String(seconds),
    }));
  };
}

export function createSignInLimiter(limits: SignInLimits = defaultSignInLimits): SignInLimiter {
  const common = {
    windowMs: limits.windowMs,
    standardHeaders: 'draft-8' as const,
    legacyHeaders: false,
    skipSuccessfulRequests: true,
    requestWasSuccessful: (_req: Request, res: { statusCode: number }) => res.statusCode < 400,
  };
  return {
    byAccount: rateLimit({
      ...common,
      limit: limits.perAccount,
      keyGenerator: emailKey,
      handler: tooMany('Too many failed sign-ins for this account.'),
    }),
    byAddress: rateLimit({
      ...common,
      limit: limits.perAddress,
      keyGenerator: (req) => `address:${ipKeyGenerator(req.ip ?? '0.0.0.0')}`,
      handler: tooMany('Too many failed sign-ins from this network.'),
    }),
    passwordResetByAccount: rateLimit({
      windowMs: 60 * 60 * 1000,
      limit: limits.resetsPerAccount,
      standardHeaders: 'draft-8',
      legacyHeaders: false,
      keyGenerator: emailKey,
      handler: tooMany('Too many password-reset e-mails asked for this address.'),
    }),
  };
}
