import { createHash } from 'node:crypto';
import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { billingControlRoutes, billingPages, billingRoutes } from './billing.ts';
import { checkoutPages, checkoutRoutes } from './checkout.ts';
import { connectPages, connectRoutes } from './connect.ts';
import { ApiError } from './errors.ts';
import { decodeFormBody, decodeQuery } from './form-body.ts';
import { newId } from './ids.ts';
import type { ApiRoute, FakeConfig, PageRoute } from './routing.ts';
import { FakeState, PLATFORM } from './state.ts';
import { WebhookSender } from './webhooks.ts';

export interface PayfakeOptions {
  port: number;
  host?: string;
  /** The only API key accepted (Authorization: Bearer ...). */
  secretKey: string;
  /** The endpoint events are posted to, and the secret they are signed with. */
  webhookUrl: string | null;
  webhookSecret: string;
  retryDelaysMs?: number[];
  log?: (line: string) => void;
}

export interface Payfake {
  port: number;
  url: string;
  state: FakeState;
  webhooks: WebhookSender;
  /** Stops answering (connections refused) but keeps every object, as an outage of the hosted service would. */
  suspend(): Promise<void>;
  resume(): Promise<void>;
  close(): Promise<void>;
}

const apiRoutes: ApiRoute[] = [...connectRoutes, ...checkoutRoutes, ...billingRoutes];
const pageRoutes: PageRoute[] = [...connectPages, ...checkoutPages, ...billingPages];
// About 17 minutes in all: long enough to outlast a restart of the API.
const defaultRetryDelaysMs = [1_000, 2_000, 4_000, 8_000, 16_000, 32_000, 64_000, 128_000, 256_000, 512_000];

function readBody(req: IncomingMessage): Promise<string> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    let size = 0;
    req.on('data', (chunk: Buffer) => {
      size += chunk.length;
      if (size > 1_000_000) reject(new ApiError(413, 'invalid_request_error', 'Request too large.'));
      else chunks.push(chunk);
    });
    req.on('end', () => resolve(Buffer.concat(chunks).toString('utf8')));
    req.on('error', reject);
  });
}

function sendJson(res: ServerResponse, status: number, body: unknown, headers: Record<string, string> = {}): void {
  res.writeHead(status, { 'Content-Type': 'application/json', 'Request-Id': newId('req', 14), ...headers });
  res.end(JSON.stringify(body));
}

interface StoredAnswer {
  requestHash: string;
  status: number;
  body: unknown;
}

function createHandler(state: FakeState, config: FakeConfig, secretKey: string) {
  const idempotency = new Map<string, StoredAnswer>();

  function authorise(req: IncomingMessage): string {
    const auth = req.headers.authorization ?? '';
    const key = auth.startsWith('Bearer ') ? auth.slice(7) : '';
    if (key !== secretKey) {
      throw new ApiError(
        401,
        'authentication_error',
        `Invalid API Key provided: ${key.slice(0, 8)}${'*'.repeat(Math.max(0, key.length - 12))}${key.slice(-4)}`,
      );
    }
    const header = req.headers['stripe-account'];
    const account = typeof header === 'string' && header !== '' ? header : PLATFORM;
    if (account !== PLATFORM && !state.hasAccount(account)) {
      throw new ApiError(
        403,
        'invalid_request_error',
        `The provided key does not have access to account '${account}' (or that account does not exist). Application access may have been revoked.`,
        'account_invalid',
      );
    }
    return account;
  }

  async function handleApi(req: IncomingMessage, res: ServerResponse, url: URL, control: boolean): Promise<void> {
    const account = control ? PLATFORM : authorise(req);
    const raw = req.method === 'POST' ? await readBody(req) : '';
    const routes = control ? billingControlRoutes : apiRoutes;
    const method = req.method ?? 'GET';
    let params: string[] | null = null;
    const route = routes.find((r) => {
      if (r.method !== method) return false;
      const match = r.pattern.exec(url.pathname);
      params = match ? match.slice(1).map(decodeURIComponent) : null;
      return match !== null;
    });
    if (!route || params === null) {
      throw new ApiError(404, 'invalid_request_error', `Unrecognized request URL (${method}: ${url.pathname}).`);
    }
    if (route.platformOnly && account !== PLATFORM) {
      throw new ApiError(400, 'invalid_request_error', 'This request cannot be made on behalf of a connected account.');
    }
    const key = req.headers['idempotency-key'];
    const storeKey = method === 'POST' && typeof key === 'string' && key !== '' ? `${account} ${key}` : null;
    const requestHash = createHash('sha256').update(`${method} ${url.pathname} ${raw}`).digest('hex');
    if (storeKey !== null) {
      const stored = idempotency.get(storeKey);
      if (stored) {
        if (stored.requestHash !== requestHash) {
          throw new ApiError(
            400,
            'idempotency_error',
            `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${String(key)}' if you meant to execute a different request.`,
          );
        }
        sendJson(res, stored.status, stored.body, { 'Idempotent-Replayed': 'true' });
        return;
      }
    }
    let status = 200;
    let body: unknown;
    try {
      body = route.handle({
        account,
        body: decodeFormBody(raw),
        query: decodeQuery(url.search),
        params,
        state,
        config,
      });
    } catch (error) {
      if (!(error instanceof ApiError)) throw error;
      status = error.status;
      body = error.body();
    }
    // The answer to a key is kept, errors of the request included, and replayed for the same request.
    if (storeKey !== null) idempotency.set(storeKey, { requestHash, status, body: structuredClone(body) });
    sendJson(res, status, body, storeKey === null ? {} : { 'Idempotency-Key': String(key) });
  }

  async function handlePage(req: IncomingMessage, res: ServerResponse, url: URL): Promise<boolean> {
    for (const route of pageRoutes) {
      const match = route.pattern.exec(url.pathname);
      if (!match) continue;
      const method = req.method ?? 'GET';
      const form = method === 'POST' ? decodeFormBody(await readBody(req)) : {};
      const answer = route.handle({ method, params: match.slice(1), form, state, config });
      if ('redirect' in answer) {
        res.writeHead(303, { Location: answer.redirect });
        res.end();
      } else {
        res.writeHead(answer.status ?? 200, {
          'Content-Type': 'text/html; charset=utf-8',
          'Cache-Control': 'no-store',
        });
        res.end(answer.html);
      }
      return true;
    }
    return false;
  }

  return async (req: IncomingMessage, res: ServerResponse): Promise<void> => {
    const url = new URL(req.url ?? '/', config.publicUrl);
    try {
      if (url.pathname === '/health') return sendJson(res, 200, { status: 'ok' });
      if (url.pathname.startsWith('/v1/')) return await handleApi(req, res, url, false);
      if (url.pathname.startsWith('/_payfake/')) return await handleApi(req, res, url, true);
      if (await handlePage(req, res, url)) return;
      throw new ApiError(404, 'invalid_request_error', `Unrecognized request URL (${req.method}: ${url.pathname}).`);
    } catch (error) {
      if (error instanceof ApiError) return sendJson(res, error.status, error.body());
      sendJson(res, 500, { error: { type: 'api_error', message: String(error) } });
    }
  };
}

function listen(server: Server, port: number, host: string): Promise<number> {
  return new Promise((resolve, reject) => {
    const onError = (error: NodeJS.ErrnoException) =>
      reject(error.code === 'EADDRINUSE' ? new Error(`Port ${port} (payment stand-in) is already in use.`) : error);
    server.once('error', onError);
    server.listen(port, host, () => {
      server.off('error', onError);
      resolve((server.address() as AddressInfo).port);
    });
  });
}

function stop(server: Server): Promise<void> {
  return new Promise((resolve) => {
    server.close(() => resolve());
    server.closeAllConnections();
  });
}

/** Starts the payment stand-in on loopback: the API the SDK calls, the hosted pages, and signed webhooks. */
export async function startPayfake(options: PayfakeOptions): Promise<Payfake> {
  const host = options.host ?? '127.0.0.1';
  const log = options.log ?? ((line: string) => process.stderr.write(`[payfake] ${line}\n`));
  const webhooks = new WebhookSender({
    url: options.webhookUrl,
    secret: options.webhookSecret,
    retryDelaysMs: options.retryDelaysMs ?? defaultRetryDelaysMs,
    log,
  });
  const state = new FakeState((event) => webhooks.send(event));
  const config: FakeConfig = { publicUrl: '' };
  const handler = createHandler(state, config, options.secretKey);
  const make = () => createServer((req, res) => void handler(req, res));
  let server = make();
  const port = await listen(server, options.port, host);
  config.publicUrl = `http://${host}:${port}`;
  state.publicUrl = config.publicUrl;
  let running = true;
  let closing: Promise<void> | null = null;
  return {
    port,
    url: config.publicUrl,
    state,
    webhooks,
    suspend: async () => {
      if (!running) return;
      running = false;
      await stop(server);
    },
    resume: async () => {
      if (running) return;
      server = make();
      await listen(server, port, host);
      running = true;
    },
    close: () =>
      (closing ??= (async () => {
        webhooks.close();
        if (running) await stop(server);
        running = false;
      })()),
  };
}
