import type { RequestHandler, Response } from 'express';
import type { AppDeps } from '../app-deps.ts';
import { HttpError } from '../lib/http-error.ts';

/**
 * The phone's clock may run a little fast; a minute covers ordinary drift (DEVELOPERS.md, Decisions: the
 * tap time). A write kept on a phone for more than a week is refused rather than backdated.
 */
export const TAP_CLOCK_SKEW_MS = 60_000;
export const TAP_MAX_AGE_MS = 7 * 86_400_000;

// An ISO 8601 instant with its offset (as Date.prototype.toISOString writes it): a time without a zone
// would be read in the server's zone, not the phone's.
const isoInstant = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d{1,3})?)?(Z|[+-]\d{2}:\d{2})$/;

function refuse(message: string, hint: string): HttpError {
  return new HttpError(422, message, 'ValidationFailed', [{ path: 'X-Tapped-At', message: hint }]);
}

/** The tap time of a header value, or why it is refused. */
export function parseTappedAt(value: string, now: Date): Date {
  const at = isoInstant.test(value) ? new Date(value) : null;
  if (!at || Number.isNaN(at.getTime())) {
    throw refuse(
      `The time this was done ("${value.slice(0, 40)}") is not a date and time Heatfleet can read.`,
      'Send an ISO 8601 time with its zone, such as 2026-12-03T10:42:00Z.',
    );
  }
  if (at.getTime() > now.getTime() + TAP_CLOCK_SKEW_MS) {
    throw refuse(
      `The time this was done (${value}) is later than now by more than a minute. Check the date and time on the phone, then send it again.`,
      'Not in the future.',
    );
  }
  if (at.getTime() < now.getTime() - TAP_MAX_AGE_MS) {
    throw refuse(
      `This was done more than 7 days ago (${value}) and waited on the phone too long to be recorded. Enter it again.`,
      'Not older than 7 days.',
    );
  }
  return at;
}

/**
 * A tap on a job's sheet cannot come before the job was booked (beyond the phone's drift): such a time is the
 * phone's clock, not the engineer's work. Throws 422 in the engineer's words.
 */
export function checkTapAfter(at: Date | null, bookedAt: Date, what = 'the job was booked'): void {
  if (at === null || at.getTime() >= bookedAt.getTime() - TAP_CLOCK_SKEW_MS) return;
  throw refuse(
    `The time this was done (${at.toISOString()}) is before ${what} (${bookedAt.toISOString()}). Check the date and time on the phone, then send it again.`,
    `Not before ${what}.`,
  );
}

/**
 * Reads `X-Tapped-At`: when the engineer tapped, which for a write sent from the phone's queue is earlier
 * than when it arrives. Sane or refused with 422 before the route runs; routes read it with tappedAtOf.
 * A route opts in with `before: () => [readTappedAt(deps)]`.
 */
export function readTappedAt(deps: AppDeps): RequestHandler {
  return (req, res, next) => {
    const value = req.get('x-tapped-at');
    res.locals.tappedAt = value === undefined ? null : parseTappedAt(value.trim(), deps.clock.now());
    next();
  };
}

/** The tap time read by readTappedAt, or null when the request did not say. */
export function tappedAtOf(res: Response): Date | null {
  const at: unknown = res.locals.tappedAt;
  return at instanceof Date ? at : null;
}
