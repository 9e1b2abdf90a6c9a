import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Knex } from 'knex';
import Stripe from 'stripe';
import { startPayfake, type Payfake } from '@heatfleet/payfake';
import { createTestApp, type Client, type SignedUp, type TestApp } from './test-app.ts';

export const TEST_STRIPE_KEY = 'sk_test_payments_suite';
export const TEST_WEBHOOK_SECRET = 'whsec_payments_suite';

export interface PaymentStack {
  t: TestApp;
  fake: Payfake;
  /** The SDK as the hosted service's dashboard would act (refunds made outside Heatfleet, and checks). */
  stripe: Stripe;
  close(): Promise<void>;
}

/**
 * A test app that listens (the payment stand-in posts its webhooks to it) and a stand-in of its own, so a
 * test can stop it or hold its events without touching another test file's.
 */
export async function startPaymentStack(): Promise<PaymentStack> {
  let handler: ((req: never, res: never) => void) | null = null;
  const server: Server = createServer((req, res) => {
    if (handler) handler(req as never, res as never);
    else res.writeHead(503).end();
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const appPort = (server.address() as AddressInfo).port;
  const fake = await startPayfake({
    port: 0,
    secretKey: TEST_STRIPE_KEY,
    webhookUrl: `http://127.0.0.1:${appPort}/api/payments/webhook`,
    webhookSecret: TEST_WEBHOOK_SECRET,
    retryDelaysMs: [100, 200, 400],
    log: () => undefined,
  });
  const t = createTestApp({
    env: {
      APP_ORIGIN: `http://127.0.0.1:${appPort}`,
      STRIPE_HOST: '127.0.0.1',
      STRIPE_PORT: String(fake.port),
      STRIPE_PROTOCOL: 'http',
      STRIPE_SECRET_KEY: TEST_STRIPE_KEY,
      STRIPE_WEBHOOK_SECRET: TEST_WEBHOOK_SECRET,
    },
  });
  handler = t.app as never;
  const stripe = new Stripe(TEST_STRIPE_KEY, { host: '127.0.0.1', port: fake.port, protocol: 'http' });
  return {
    t,
    fake,
    stripe,
    close: async () => {
      await fake.close();
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await t.close();
    },
  };
}

export async function postForm(url: string, fields: Record<string, string>): Promise<Response> {
  return fetch(url, {
    method: 'POST',
    headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams(fields).toString(),
    redirect: 'manual',
  });
}

/** The Owner connects the firm's payment account and finishes the stand-in's onboarding page. */
export async function connectFirm(stack: PaymentStack, owner: SignedUp): Promise<string> {
  const link = await owner.client.post('/api/payments/account/onboarding');
  if (link.status !== 200) throw new Error(`onboarding: ${link.status} ${JSON.stringify(link.body)}`);
  const finished = await postForm((link.body as { url: string }).url, { sort_code: '10-88-00' });
  if (finished.status !== 303) throw new Error(`onboarding page answered ${finished.status}`);
  await stack.fake.webhooks.settled();
  const row = (await stack.t.deps.db('payment_accounts').where({ firm_id: owner.firmId }).first()) as {
    provider_account_id: string;
  };
  return row.provider_account_id;
}

/** An issued invoice written straight to the tables (the money module's issuing is tested on its own). */
export async function insertIssuedInvoice(db: Knex, firmId: number, totalPence: number): Promise<number> {
  const [customerId] = (await db('customers').insert({
    firm_id: firmId,
    name: 'Pat Example',
    email: 'pat@customer.example',
  })) as number[];
  const [last] = (await db('invoices').where({ firm_id: firmId }).max({ n: 'number' })) as { n: number | null }[];
  const [id] = (await db('invoices').insert({
    firm_id: firmId,
    customer_id: customerId,
    number: (last?.n ?? 0) + 1,
    status: 'issued',
    supplied_at: new Date(),
    issued_at: new Date(),
    issued_on: '2026-12-03',
    due_on: '2027-01-02',
    firm_name: 'Payments test firm',
    vat_registered: false,
    customer_name: 'Pat Example',
    customer_address: '1 Sample Row, Testbury',
    customer_email: 'pat@customer.example',
    net_pence: totalPence,
    vat_pence: 0,
    total_pence: totalPence,
  })) as number[];
  return id!;
}

export async function invoiceMoney(db: Knex, invoiceId: number): Promise<{ status: string; paid: number }> {
  const row = (await db('invoices').where({ id: invoiceId }).first('status', 'paid_pence')) as {
    status: string;
    paid_pence: number;
  };
  return { status: row.status, paid: Number(row.paid_pence) };
}

/** The doorstep link's token (as the QR code carries it). */
export async function payToken(client: Client, invoiceId: number): Promise<string> {
  const res = await client.post(`/api/invoices/${invoiceId}/pay-link`);
  if (res.status !== 201) throw new Error(`pay-link: ${res.status} ${JSON.stringify(res.body)}`);
  const match = /\/pay\/([A-Za-z0-9_-]+)/.exec((res.body as { url: string }).url);
  return match![1]!;
}

/** The customer opens the link (our public page asks for a checkout) and pays on the hosted page. */
export async function payAsCustomer(
  stack: PaymentStack,
  client: Client,
  token: string,
  card: string,
): Promise<{ checkoutUrl: string; page: Response }> {
  const started = await client.post(`/api/pay/${token}/checkout`, { from: 'doorstep' });
  if (started.status !== 201) throw new Error(`checkout: ${started.status} ${JSON.stringify(started.body)}`);
  const checkoutUrl = (started.body as { url: string }).url;
  const page = await postForm(checkoutUrl, { card_number: card, expiry: '12 / 34', cvc: '123' });
  await stack.fake.webhooks.settled();
  return { checkoutUrl, page };
}
