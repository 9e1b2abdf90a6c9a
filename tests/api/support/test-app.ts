import request from 'supertest';
import type { Express } from 'express';
import { createApp } from '@heatfleet/api/app.ts';
import { parseEnv, type Env } from '@heatfleet/api/config/env.ts';
import { closeDeps, createDeps } from '@heatfleet/api/create-deps.ts';
import type { AppDeps } from '@heatfleet/api/app-deps.ts';
import type { SignInLimits } from '@heatfleet/api/modules/auth/sign-in-limiter.ts';

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

export function createTestApp(opts: { env?: Partial<Record<keyof Env, string>>; limits?: SignInLimits } = {}): TestApp {
  const env = parseEnv({ ...process.env, LOG_LEVEL: process.env.TEST_LOG_LEVEL ?? 'error', ...opts.env });
  const clock = new TestClock();
  const deps = createDeps(env, { clock, limits: opts.limits });
  return { app: createApp(deps), deps, clock, close: () => closeDeps(deps) };
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
    const res = await this.agent[method](url).set('X-CSRF-Token', this.csrfToken).send(body as object);
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
  async upload(url: string, fields: Record<string, string>, file?: { field: string; content: Buffer; filename: string; contentType?: string }) {
    if (!this.csrfToken) await this.refreshCsrf();
    let req = this.agent.post(url).set('X-CSRF-Token', this.csrfToken);
    for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
    if (file) req = req.attach(file.field, file.content, { filename: file.filename, contentType: file.contentType ?? 'application/octet-stream' });
    return req;
  }
}

export interface SignedUp {
  client: Client;
  email: string;
  userId: number;
  firmId: number;
}

export async function signUpFirm(app: Express, label = 'owner', firmName = `Firm ${label}`): Promise<SignedUp> {
  const client = new Client(app);
  const email = uniqueEmail(label);
  const res = await client.post('/api/auth/sign-up', { firmName, name: `Person ${label}`, email, password: TEST_PASSWORD });
  if (res.status !== 201) throw new Error(`sign-up failed: ${res.status} ${JSON.stringify(res.body)}`);
  const me = (res.body as { me: { user: { id: number }; activeFirm: { id: number } } }).me;
  return { client, email, userId: me.user.id, firmId: me.activeFirm.id };
}

export async function signIn(app: Express, email: string, password = TEST_PASSWORD): Promise<Client> {
  const client = new Client(app);
  const res = await client.post('/api/auth/sign-in', { email, password });
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status} ${JSON.stringify(res.body)}`);
  return client;
}
