import { randomUUID } from 'node:crypto';
import { expect, request as playwrightRequest, type APIRequestContext } from '@playwright/test';

/** One person's API client: the session cookie lives in the context, the CSRF token goes with every write. */
export interface ApiSession {
  api: APIRequestContext;
  csrf: string;
}

const opened: APIRequestContext[] = [];

/** A new client with a session of its own and that session's CSRF token (GET /api/auth/csrf). */
export async function openApiSession(baseURL: string): Promise<ApiSession> {
  const api = await playwrightRequest.newContext({ baseURL });
  opened.push(api);
  const answer = await api.get('/api/auth/csrf');
  expect(answer.status(), await answer.text()).toBe(200);
  return { api, csrf: ((await answer.json()) as { csrfToken: string }).csrfToken };
}

/** Closes every client opened since the last call (the fixture test does this after each test). */
export async function disposeApiSessions(): Promise<void> {
  for (const api of opened.splice(0)) await api.dispose();
}

interface CallOptions {
  data?: unknown;
  /** The status the call must answer: 201 for a POST and 200 otherwise unless given. */
  status?: number;
  /** Sends a fresh Idempotency-Key, as the app does for stock and custody writes. */
  idempotent?: boolean;
}

/** One API call that must answer as expected; its JSON body. Writes carry the session's CSRF token. */
export async function callApi<T>(
  session: ApiSession,
  method: 'get' | 'post' | 'put' | 'patch',
  path: string,
  options: CallOptions = {},
): Promise<T> {
  const headers: Record<string, string> = {};
  if (method !== 'get') headers['X-CSRF-Token'] = session.csrf;
  if (options.idempotent) headers['Idempotency-Key'] = randomUUID();
  const answer = await session.api.fetch(path, {
    method,
    headers,
    ...(options.data !== undefined && { data: options.data }),
  });
  const status = options.status ?? (method === 'post' ? 201 : 200);
  expect(answer.status(), `${method.toUpperCase()} ${path}: ${await answer.text()}`).toBe(status);
  return (await answer.json()) as T;
}
