import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import { ForbiddenError } from '@casl/ability';
import { apiErrorNames, type ApiErrorBody } from '@heatfleet/domain';
import { HttpError } from '../lib/http-error.ts';
import { isDatabaseUnavailable } from '../db/db-errors.ts';

function send(res: Parameters<ErrorRequestHandler>[2], body: ApiErrorBody, headers: Record<string, string> = {}) {
  for (const [name, value] of Object.entries(headers)) res.setHeader(name, value);
  res.status(body.statusCode).json(body);
}

export const notFoundHandler: RequestHandler = (req, _res, next) => {
  next(new HttpError(404, `There is no ${req.method} ${req.path} in the API.`));
};

/**
 * The body parser's own failures (an unknown charset or Content-Encoding, a body that does not
 * inflate, a body cut short of its Content-Length) are the client's, not ours: each becomes a 4xx
 * in plain words instead of a 500.
 */
function bodyReadProblem(err: unknown): { status: 400 | 415; message: string } | null {
  const e = err as { type?: string; status?: number; expose?: boolean } | null;
  // Only 400 and 415: the parser's other failures (413) have their own branch, and a CSRF refusal is a 403.
  if (!e || (e.status !== 400 && e.status !== 415) || e.expose !== true) return null;
  switch (e.type) {
    case 'charset.unsupported':
      return { status: 415, message: 'The request body must be sent as UTF-8 text.' };
    case 'encoding.unsupported':
      return {
        status: 415,
        message: 'The request body is compressed in a way Heatfleet does not read (send it plain, gzip or deflate).',
      };
    case 'request.aborted':
    case 'request.size.invalid':
      return { status: 400, message: 'The request body arrived incomplete. Check your connection and try again.' };
    default:
      return { status: 400, message: 'The request body could not be read.' };
  }
}

/** The one error handler: every failure leaves as the shared error body, and nothing internal leaks. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  const requestId = req.id ?? 'unknown';
  if (res.headersSent) {
    req.log?.error({ err }, 'error after the response started');
    res.end();
    return;
  }
  if (err instanceof ZodError) {
    const details = err.issues.map((issue) => ({ path: issue.path.join('.') || '(body)', message: issue.message }));
    const first = details[0];
    send(res, {
      statusCode: 422,
      error: apiErrorNames[422],
      message: first
        ? first.path === '(body)'
          ? first.message
          : `${first.path}: ${first.message}`
        : 'The request is not valid.',
      details,
      requestId,
    });
    return;
  }
  if (err instanceof HttpError) {
    send(
      res,
      { statusCode: err.statusCode, error: err.error, message: err.message, details: err.details, requestId },
      err.headers,
    );
    return;
  }
  if (err instanceof ForbiddenError) {
    send(res, {
      statusCode: 403,
      error: apiErrorNames[403],
      message: 'Your role in this firm does not allow that.',
      requestId,
    });
    return;
  }
  const e = err as { type?: string; code?: string; status?: number };
  if (e.type === 'entity.parse.failed') {
    send(res, { statusCode: 400, error: 'InvalidJson', message: 'The request body is not valid JSON.', requestId });
    return;
  }
  if (e.type === 'entity.too.large') {
    send(res, { statusCode: 413, error: apiErrorNames[413], message: 'The request body is too large.', requestId });
    return;
  }
  const bodyProblem = bodyReadProblem(err);
  if (bodyProblem) {
    send(res, {
      statusCode: bodyProblem.status,
      error: bodyProblem.status === 415 ? apiErrorNames[415] : 'UnreadableBody',
      message: bodyProblem.message,
      requestId,
    });
    return;
  }
  if (e.code === 'EBADCSRFTOKEN') {
    send(res, {
      statusCode: 403,
      error: 'CsrfTokenInvalid',
      message: 'This page is out of date: reload it and try again.',
      requestId,
    });
    return;
  }
  if (isDatabaseUnavailable(err)) {
    req.log?.warn({ err }, 'database unavailable');
    send(
      res,
      {
        statusCode: 503,
        error: apiErrorNames[503],
        message: 'Heatfleet cannot reach its database just now. Nothing was changed; try again in a minute.',
        requestId,
      },
      { 'Retry-After': '10' },
    );
    return;
  }
  if (e.code === 'ER_DUP_ENTRY') {
    send(res, { statusCode: 409, error: apiErrorNames[409], message: 'That already exists.', requestId });
    return;
  }
  req.log?.error({ err }, 'unhandled error');
  send(res, {
    statusCode: 500,
    error: apiErrorNames[500],
    message: `Something went wrong on our side. Quote reference ${requestId} if you contact support.`,
    requestId,
  });
};
