import { randomUUID } from 'node:crypto';
import autocannon from 'autocannon';

export interface Session {
  email: string;
  cookie: string;
  csrfToken: string;
}

export interface LoadResult {
  connections: number;
  seconds: number;
  requestsPerSecond: number;
  p50Ms: number;
  p99Ms: number;
  requests: number;
  /** Answers other than 2xx, plus connection errors and timeouts. */
  errors: number;
  statusCounts: Record<string, number>;
}

function firstCookie(response: Response): string | null {
  const set = response.headers.getSetCookie()[0];
  return set === undefined ? null : set.split(';')[0]!;
}

/** Signs in as the API's own client does: a CSRF token first, then the sign-in with it. */
export async function signIn(base: string, email: string, password: string): Promise<Session> {
  const csrf = await fetch(`${base}/api/auth/csrf`);
  const firstSid = firstCookie(csrf);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  if (firstSid === null) throw new Error('No session cookie from /api/auth/csrf.');
  const answer = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', cookie: firstSid, 'x-csrf-token': csrfToken },
    body: JSON.stringify({ email, password }),
  });
  if (!answer.ok) throw new Error(`Sign-in as ${email} answered ${answer.status}: ${await answer.text()}`);
  const body = (await answer.json()) as { csrfToken: string };
  return { email, cookie: firstCookie(answer) ?? firstSid, csrfToken: body.csrfToken };
}

export async function getJson<T>(base: string, session: Session, path: string): Promise<{ status: number; body: T }> {
  // A read slower than this is reported as not measured rather than holding up the run.
  const answer = await fetch(`${base}${path}`, {
    headers: { cookie: session.cookie },
    signal: AbortSignal.timeout(30_000),
  });
  const text = await answer.text();
  return { status: answer.status, body: (text ? JSON.parse(text) : null) as T };
}

export async function postJson<T>(
  base: string,
  session: Session,
  path: string,
  body: unknown,
): Promise<{ status: number; body: T }> {
  const answer = await fetch(`${base}${path}`, {
    method: 'POST',
    headers: {
      'content-type': 'application/json',
      cookie: session.cookie,
      'x-csrf-token': session.csrfToken,
      'idempotency-key': randomUUID(),
    },
    body: JSON.stringify(body),
  });
  const text = await answer.text();
  return { status: answer.status, body: (text ? JSON.parse(text) : null) as T };
}

/** One request at a time, `count` times: the median and slowest milliseconds of one request alone. */
export async function serialLatency(
  url: string,
  headers: Record<string, string>,
  count: number,
): Promise<{ medianMs: number; maxMs: number; status: number }> {
  const times: number[] = [];
  let status = 0;
  for (let n = 0; n < count; n += 1) {
    const began = performance.now();
    const answer = await fetch(url, { headers });
    await answer.arrayBuffer();
    times.push(performance.now() - began);
    status = answer.status;
  }
  times.sort((a, b) => a - b);
  return { medianMs: round(times[Math.floor(times.length / 2)]!), maxMs: round(times[times.length - 1]!), status };
}

export function round(value: number, places = 1): number {
  const f = 10 ** places;
  return Math.round(value * f) / f;
}

export interface LoadOptions {
  url: string;
  connections: number;
  seconds: number;
  method?: 'GET' | 'POST';
  headers?: Record<string, string>;
  /** For writes: a body per request (given its running number), each sent with a fresh Idempotency-Key. */
  bodyFor?: (request: number) => unknown;
}

/** Drives one URL with autocannon on 127.0.0.1 and reduces its answer to what the report needs. */
export function load(options: LoadOptions): Promise<LoadResult> {
  let sent = 0;
  const bodyFor = options.bodyFor;
  const cannonOptions: autocannon.Options = {
    url: options.url,
    connections: options.connections,
    duration: options.seconds,
    method: options.method ?? 'GET',
    headers: { ...(options.headers ?? {}), ...(bodyFor ? { 'content-type': 'application/json' } : {}) },
    ...(bodyFor && {
      requests: [
        {
          setupRequest: (req: autocannon.Request) => ({
            ...req,
            headers: { ...req.headers, 'idempotency-key': randomUUID() },
            body: JSON.stringify(bodyFor(sent++)),
          }),
        },
      ],
    }),
  };
  return new Promise((resolve, reject) => {
    autocannon(cannonOptions, (error: Error | null, result: autocannon.Result) => {
      if (error) return reject(error);
      const statusCounts: Record<string, number> = {};
      for (const [code, n] of Object.entries(result.statusCodeStats ?? {})) statusCounts[code] = n.count ?? 0;
      resolve({
        connections: options.connections,
        seconds: options.seconds,
        requestsPerSecond: round(result.requests.average),
        p50Ms: result.latency.p50,
        p99Ms: result.latency.p99,
        requests: result.requests.total,
        errors: result.non2xx + result.errors + result.timeouts,
        statusCounts,
      });
    });
  });
}
