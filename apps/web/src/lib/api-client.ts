import { apiErrorBodySchema, csrfResponseSchema, type ApiErrorDetail } from '@heatfleet/domain';
import type { z } from 'zod';
import { FROM_CACHE_HEADER, SCOPE_HEADER } from '@/lib/offline/api-cache-rules';
import { noteAnswer } from '@/lib/offline/data-age';
import { activeScope, scopeHeaderValue } from '@/lib/offline/scope';
import { withOutboxLock } from '@/lib/offline/outbox-lock';

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

/** A token fetched now, for a queue sent after a while (the session may have been renewed meanwhile). */
export async function refreshCsrfToken(): Promise<void> {
  setCsrfToken(null);
  await getCsrfToken();
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
  /** Sent as X-Tapped-At: when the engineer tapped, for a write sent later from the queue (lib/offline). */
  tappedAt?: string;
  /** A read that must come from the server, never from the service worker's copy. */
  fresh?: boolean;
}

// Requests that change whose session it is or which firm it acts for wait while the write queue is being sent,
// so a queued write never goes out under another firm (lib/offline/outbox-lock.ts).
const sessionChanging = new Set(['/api/me/active-firm', '/api/auth/sign-out', '/api/auth/sign-in']);

/** Notes, for an API read, whether the service worker answered from its cache and when the answer was made. */
function noteRead(path: string, response: Response, startedAt: number): void {
  const date = Date.parse(response.headers.get('Date') ?? '');
  noteAnswer(path, {
    fromCache: response.headers.get(FROM_CACHE_HEADER) === '1',
    madeAt: Number.isNaN(date) ? null : date,
    startedAt,
  });
}

// GETs started before anything asked for them (app/early-data.ts): a page's first reads leave with its chunk
// instead of after it. The first `send` of the same path takes the answer; one older than 10 s is not used.
const earlyGets = new Map<string, { at: number; response: Promise<Response>; json: Promise<unknown> }>();
const EARLY_GET_MS = 10_000;

function readHeaders(): Record<string, string> {
  const scope = activeScope();
  return { Accept: 'application/json', ...(scope ? { [SCOPE_HEADER]: scopeHeaderValue(scope) } : {}) };
}

/** Starts a GET now, for the first `apiClient.get` of the same path to take. */
export function startEarlyGet(path: string): void {
  if (earlyGets.has(path)) return;
  const response = fetch(path, { method: 'GET', headers: readHeaders(), credentials: 'same-origin' });
  // A copy of the body for peekEarlyGet, read before `send` reads the original.
  const json = response.then((r) => (r.ok ? r.clone().json() : null)).catch(() => null);
  response.catch(() => undefined);
  earlyGets.set(path, { at: Date.now(), response, json });
}

/** The body of an early GET still waiting to be taken (null if it failed or there is none). */
export function peekEarlyGet(path: string): Promise<unknown> {
  return earlyGets.get(path)?.json ?? Promise.resolve(null);
}

function takeEarlyGet(path: string): { at: number; response: Promise<Response> } | undefined {
  const early = earlyGets.get(path);
  if (!early) return undefined;
  earlyGets.delete(path);
  return Date.now() - early.at < EARLY_GET_MS ? early : undefined;
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
  if (options.tappedAt) headers['X-Tapped-At'] = options.tappedAt;
  const scope = activeScope();
  // Without the scope header the service worker neither keeps nor answers from its copy.
  if (method === 'GET' && scope && !options.fresh) headers[SCOPE_HEADER] = scopeHeaderValue(scope);

  let response: Response;
  const early = method === 'GET' && !options.fresh ? takeEarlyGet(path) : undefined;
  const startedAt = early?.at ?? Date.now();
  try {
    response = await (early?.response ??
      fetch(path, {
        method,
        headers,
        credentials: 'same-origin',
        body: body === undefined ? undefined : isForm ? body : JSON.stringify(body),
      }));
  } catch {
    throw new ApiError({ status: 0, code: 'NetworkError', message: UNREACHABLE_MESSAGE });
  }

  if (method === 'GET') noteRead(path, response, startedAt);
  if (!response.ok) throw await toApiError(response);
  if (response.status === 204) return undefined;
  const text = await response.text();
  return text ? (JSON.parse(text) as unknown) : undefined;
}

async function request(method: Method, path: string, body?: unknown, options?: RequestOptions): Promise<unknown> {
  if (method === 'GET') return send(method, path, undefined, undefined, options);
  if (sessionChanging.has(path)) return withOutboxLock(() => writeOnce(method, path, body, options));
  return writeOnce(method, path, body, options);
}

async function writeOnce(method: Method, path: string, body?: unknown, options?: RequestOptions): Promise<unknown> {
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
  get: async <T extends z.ZodType>(path: string, schema: T, options?: Pick<RequestOptions, 'fresh'>) =>
    parseWith(schema, await request('GET', path, undefined, options)),
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
  /** A write from the phone's queue (lib/offline): its answer unparsed, for the form that queued it to read. */
  write: (method: Exclude<Method, 'GET'>, path: string, body: unknown, options: RequestOptions) =>
    request(method, path, body, options),
};
