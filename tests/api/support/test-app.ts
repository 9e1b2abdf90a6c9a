import request from 'supertest';
import type { Express } from 'express';
import { createApp } from '@heatfleet/api/app.ts';
import { parseEnv, type Env } from '@heatfleet/api/config/env.ts';
import { closeDeps, createDeps } from '@heatfleet/api/create-deps.ts';
import type { AppDeps } from '@heatfleet/api/app-deps.ts';
import type { RateLimits } from '@heatfleet/api/modules/auth/rate-limits.ts';

/** A clock the test moves by hand. */
export class TestClock {
  private offsetMs = 0;
  now(): Date {
    return new Date(Date.now() + this.offsetMs);
  }
  advance(ms: number): void {
    this.offsetMs += ms;
  }
}

export interface TestApp {
  app: Express;
  deps: AppDeps;
  clock: TestClock;
  close(): Promise<void>;
}

/**
 * Every test signs its firms up from one address (127.0.0.1), so the per-address limits on sign-ups
 * and reset e-mails, which count every request, are lifted here; tests/api/rate-limit.test.ts and
 * security-hardening.test.ts set them back to test them.
 */
export const testRateLimits: Partial<RateLimits> = {
  signUpsPerAddress: 100_000,
  resetsPerAddress: 100_000,
  invitationsPerAddress: 100_000,
};

export function createTestApp(
  opts: { env?: Partial<Record<keyof Env, string>>; limits?: Partial<RateLimits> } = {},
): TestApp {
  const env = parseEnv({ ...process.env, LOG_LEVEL: process.env.TEST_LOG_LEVEL ?? 'error', ...opts.env });
  const clock = new TestClock();
  const deps = createDeps(env, { clock, limits: { ...testRateLimits, ...opts.limits } });
  const app = createApp(deps);
  // signUpFirm reads the confirmation link from the e-mail written to the database.
  app.locals.deps = deps;
  return { app, deps, clock, close: () => closeDeps(deps) };
}

let counter = 0;
/** An address no other test uses, so tests can share one database and run in parallel. */
export function uniqueEmail(label: string): string {
  counter += 1;
  return `${label}-${process.pid}-${Date.now().toString(36)}-${counter}@test.example`;
}

export const TEST_PASSWORD = 'correct horse battery staple';

/** A supertest agent that keeps the cookie and sends the session's CSRF token on every change. */
export class Client {
  readonly agent: ReturnType<typeof request.agent>;
  csrfToken = '';

  constructor(readonly app: Express) {
    this.agent = request.agent(app);
  }

  async refreshCsrf(): Promise<void> {
    const res = await this.agent.get('/api/auth/csrf').expect(200);
    this.csrfToken = (res.body as { csrfToken: string }).csrfToken;
  }

  get(url: string) {
    return this.agent.get(url);
  }

  private async send(method: 'post' | 'put' | 'patch' | 'delete', url: string, body?: unknown) {
    if (!this.csrfToken) await this.refreshCsrf();
    const res = await this.agent[method](url)
      .set('X-CSRF-Token', this.csrfToken)
      .send(body as object);
    const fresh = (res.body as { csrfToken?: string } | undefined)?.csrfToken;
    if (fresh) this.csrfToken = fresh;
    return res;
  }

  post(url: string, body?: unknown) {
    return this.send('post', url, body);
  }
  put(url: string, body?: unknown) {
    return this.send('put', url, body);
  }
  patch(url: string, body?: unknown) {
    return this.send('patch', url, body);
  }
  delete(url: string) {
    return this.send('delete', url);
  }

  /** A multipart upload with the session's CSRF token. */
  async upload(
    url: string,
    fields: Record<string, string>,
    file?: { field: string; content: Buffer; filename: string; contentType?: string },
  ) {
    if (!this.csrfToken) await this.refreshCsrf();
    let req = this.agent.post(url).set('X-CSRF-Token', this.csrfToken);
    for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
    if (file)
      req = req.attach(file.field, file.content, {
        filename: file.filename,
        contentType: file.contentType ?? 'application/octet-stream',
      });
    return req;
  }
}

export interface SignedUp {
  client: Client;
  email: string;
  userId: number;
  firmId: number;
}

/** The token of the newest link of that kind e-mailed to the address (the e-mail row written in the request's transaction). */
export async function linkTokenFromEmail(
  app: Express,
  to: string,
  kind: 'sign-up/confirm' | 'reset-password' | 'invitations',
): Promise<string> {
  const deps = app.locals.deps as AppDeps;
  const row = await deps.db('emails').where({ to_address: to }).orderBy('id', 'desc').first('text_body');
  const match = new RegExp(`/${kind}/([A-Za-z0-9_-]+)`).exec((row?.text_body as string | undefined) ?? '');
  if (!match?.[1]) throw new Error(`no ${kind} link e-mailed to ${to}`);
  return match[1];
}

/** Signs a new firm up as a new person would: the form, then the link from the e-mail. */
export async function signUpFirm(app: Express, label = 'owner', firmName = `Firm ${label}`): Promise<SignedUp> {
  const client = new Client(app);
  const email = uniqueEmail(label);
  const asked = await client.post('/api/auth/sign-up', {
    firmName,
    name: `Person ${label}`,
    email,
    password: TEST_PASSWORD,
  });
  if (asked.status !== 202) throw new Error(`sign-up failed: ${asked.status} ${JSON.stringify(asked.body)}`);
  const token = await linkTokenFromEmail(app, email, 'sign-up/confirm');
  const res = await client.post('/api/auth/sign-up/confirm', { token });
  if (res.status !== 201) throw new Error(`sign-up confirmation failed: ${res.status} ${JSON.stringify(res.body)}`);
  const me = (res.body as { me: { user: { id: number }; activeFirm: { id: number } } }).me;
  return { client, email, userId: me.user.id, firmId: me.activeFirm.id };
}

export async function signIn(app: Express, email: string, password = TEST_PASSWORD): Promise<Client> {
  const client = new Client(app);
  const res = await client.post('/api/auth/sign-in', { email, password });
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status} ${JSON.stringify(res.body)}`);
  return client;
}
