import { apiErrorNames, type ApiErrorDetail } from '@heatfleet/domain';

type Status = keyof typeof apiErrorNames;

/** An error meant for the user: its message is shown as it is, so write it in their words. */
export class HttpError extends Error {
  constructor(
    readonly statusCode: Status,
    message: string,
    readonly error: string = apiErrorNames[statusCode],
    readonly details?: ApiErrorDetail[],
    readonly headers: Record<string, string> = {},
  ) {
    super(message);
  }
}

export const notFound = (what: string) => new HttpError(404, `${what} was not found.`);
export const ruleBroken = (message: string, details?: ApiErrorDetail[]) =>
  new HttpError(400, message, 'RuleBroken', details);
export const conflict = (message: string) => new HttpError(409, message);
export const notAllowed = (message = 'Your role in this firm does not allow that.') => new HttpError(403, message);
export const signedOut = (message = 'Please sign in.') => new HttpError(401, message);
