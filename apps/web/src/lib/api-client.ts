import { apiErrorBodySchema, csrfResponseSchema, type ApiErrorDetail } from '@heatfleet/domain';
import type { z } from 'zod';

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly details: ApiErrorDetail[];
  readonly requestId: string | undefined;
  readonly retryAfterSeconds: number | undefined;

  constructor(init: {
    status: number;
    code: string;
    message: string;
    details?: ApiErrorDetail[] | undefined;
    requestId?: string | undefined;
    retryAfterSeconds?: number | undefined;
  }) {
    super(init.message);
    this.name = 'ApiError';
    this.status = init.status;
    this.code = init.code;
    this.details = init.details ?? [];
    this.requestId = init.requestId;
    this.retryAfterSeconds = init.retryAfterSeconds;
  }
}

export function isApiError(error: unknown, status?: number): error is ApiError {
  return error instanceof ApiError && (status === undefined || error.status === status);
}

const UNREACHABLE_MESSAGE = 'Heatfleet could not reach its server. Check your connection and try again.';

// The token belongs to the session: it is replaced whenever the session changes and fetched lazily otherwise.
let csrfToken: string | null = null;
let csrfTokenRequest: Promise<string> | null = null;

export function setCsrfToken(token: string | null): void {
  csrfToken = token;
}

async function getCsrfToken(): Promise<string> {
  if (csrfToken) return csrfToken;
  csrfTokenRequest ??= send('GET', '/api/auth/csrf', undefined, undefined)
    .then((body) => {
      const token = csrfResponseSchema.parse(body).csrfToken;
      csrfToken = token;
      return token;
    })
    .finally(() => {
      csrfTokenRequest = null;
    });
  return csrfTokenRequest;
}

function parseRetryAfter(header: string | null): number | undefined {
  if (!header) return undefined;
  const seconds = Number(header);
  if (Number.isFinite(seconds)) return Math.max(0, Math.ceil(seconds));
  const at = Date.parse(header);
  return Number.isNaN(at) ? undefined : Math.max(0, Math.ceil((at - Date.now()) / 1000));
}

async function toApiError(response: Response): Promise<ApiError> {
  const retryAfterSeconds = parseRetryAfter(response.headers.get('Retry-After'));
  const body: unknown = await response.json().catch(() => null);
  const parsed = apiErrorBodySchema.safeParse(body);
  if (parsed.success) {
    return new ApiError({
      status: parsed.data.statusCode,
      code: parsed.data.error,
      message: parsed.data.message,
      details: parsed.data.details,
      requestId: parsed.data.requestId,
      retryAfterSeconds,
    });
  }
  // Only a proxy or a crashed server answers without the shared error body.
  return new ApiError({
    status: response.status,
    code: 'UnexpectedResponse',
    message:
      response.status >= 500
        ? 'Heatfleet is not answering properly just now. Please try again in a minute.'
        : `The server answered ${response.status} without an explanation.`,
    retryAfterSeconds,
  });
}

export interface RequestOptions {
  /** Sent as the Idempotency-Key header: the same key on a retry makes the server replay its first answer. */
  idempotencyKey?: string;
}

async function send(
  method: Method,
  path: string,
  body: unknown,
  token: string | undefined,
  options: RequestOptions = {},
): Promise<unknown> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  // FormData sets its own multipart Content-Type with the boundary; naming it here would drop the boundary.
  const isForm = body instanceof FormData;
  if (body !== undefined && !isForm) headers['Content-Type'] = 'application/json';
  if (token) headers['X-CSRF-Token'] = token;
  if (options.idempotencyKey) headers['Idempotency-Key'] = options.idempotencyKey;

  let response: Response;
  try {
    response = await fetch(path, {
      method,
      headers,
      credentials: 'same-origin',
      body: body === undefined ? undefined : isForm ? body : JSON.stringify(body),
    });
  } catch {
    throw new ApiError({ status: 0, code: 'NetworkError', message: UNREACHABLE_MESSAGE });
  }

  if (!response.ok) throw await toApiError(response);
  if (response.status === 204) return undefined;
  const text = await response.text();
  return text ? (JSON.parse(text) as unknown) : undefined;
}

async function request(method: Method, path: string, body?: unknown, options?: RequestOptions): Promise<unknown> {
  if (method === 'GET') return send(method, path, undefined, undefined);
  try {
    return await send(method, path, body, await getCsrfToken(), options);
  } catch (error) {
    // The session may have changed under us (another tab signed in or out): fetch a fresh token and try once more.
    if (isApiError(error, 403) && error.code === 'CsrfTokenInvalid') {
      setCsrfToken(null);
      return send(method, path, body, await getCsrfToken(), options);
    }
    throw error;
  }
}

function parseWith<T extends z.ZodType>(schema: T, data: unknown): z.infer<T> {
  return schema.parse(data);
}

export const apiClient = {
  get: async <T extends z.ZodType>(path: string, schema: T) => parseWith(schema, await request('GET', path)),
  post: async <T extends z.ZodType>(path: string, body: unknown, schema: T, options?: RequestOptions) =>
    parseWith(schema, await request('POST', path, body, options)),
  /** A multipart upload (a photo); the body is FormData. */
  upload: async <T extends z.ZodType>(path: string, form: FormData, schema: T) =>
    parseWith(schema, await request('POST', path, form)),
  put: async <T extends z.ZodType>(path: string, body: unknown, schema: T) =>
    parseWith(schema, await request('PUT', path, body)),
  patch: async <T extends z.ZodType>(path: string, body: unknown, schema: T) =>
    parseWith(schema, await request('PATCH', path, body)),
  /** For answers with no body worth reading (204). */
  send: async (method: Exclude<Method, 'GET'>, path: string, body?: unknown): Promise<void> => {
    await request(method, path, body);
  },
};
