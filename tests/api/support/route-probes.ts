import { completionCodes } from '@heatfleet/domain';
import type { RouteDefinition } from '@heatfleet/api/routes/route-registry.ts';
import type { SeededFirm } from './seed-firm.ts';
import { uniqueEmail, type Client } from './test-app.ts';

export const routeKey = (r: Pick<RouteDefinition, 'method' | 'path'>) => `${r.method.toUpperCase()} ${r.path}`;

/**
 * How to fill each path parameter from a seeded firm, by the resource the path names.
 * A new route with a parameter the harness cannot fill fails the tests until it is added here.
 */
const pathIds: Record<string, (f: SeededFirm) => string> = {
  'members:id': (f) => String(f.target.memberId),
  'invitations:id': (f) => String(f.invitation.id),
  'invitations:token': (f) => f.invitation.token,
  'outbox:id': () => 'does-not-exist',
  'vans:id': (f) => String(f.van.id),
  'kits:id': (f) => String(f.kit.id),
  'kit-items:id': (f) => String(f.looseItemId),
  'item-kinds:id': (f) => String(f.kindId),
  'photos:id': (f) => String(f.photoId),
  'products:id': (f) => String(f.product.id),
  'stock:id': (f) => String(f.movementId),
  'customers:id': (f) => String(f.customerId),
  'jobs:id': (f) => String(f.jobId),
  // The seeded job's survey has one radiator (index 0).
  'jobs:step': () => 'dose_cleaner',
  'jobs:index': () => '0',
  'jobs:phase': () => 'before',
  'jobs:kind': () => 'acknowledgement',
  'sites:id': (f) => String(f.siteId),
  // An unsubscribe link's token is its own capability; a made-up one answers 404.
  'unsubscribe:token': () => 'u'.repeat(43),
  // Money (support/seed-money.ts).
  'price-items:id': (f) => String(f.money.priceItemId),
  'invoices:id': (f) => String(f.money.invoiceId),
  'credit-notes:id': (f) => String(f.money.creditNoteId),
  'quotes:id': (f) => String(f.money.quoteId),
  // The customer's quote link: a made-up token answers 404 (money-quotes.test.ts uses real ones).
  'public:token': () => 'q'.repeat(43),
  'payments:id': (f) => String(f.paymentId),
  // The customer's pay link: a made-up token answers 404 (payments-*.test.ts use real ones).
  'pay:token': () => 'p'.repeat(43),
};

/** A valid body per route, built from a firm's records (so another firm's ids can be slipped in). */
const bodies: Record<string, (f: SeededFirm) => unknown> = {
  'POST /auth/sign-up': () => ({
    firmName: 'Probe firm',
    name: 'Probe',
    email: uniqueEmail('probe'),
    password: 'probe password 123',
  }),
  'POST /auth/sign-in': (f) => ({ email: f.people.engineer.email, password: 'wrong password probe' }),
  'POST /auth/password-reset': (f) => ({ email: f.people.engineer.email }),
  'POST /auth/sign-up/confirm': () => ({ token: 'y'.repeat(43) }),
  'POST /me/firms': () => ({ firmName: 'Probe second firm' }),
  'POST /auth/password-reset/confirm': () => ({ token: 'x'.repeat(43), password: 'probe password 123' }),
  'PUT /me/active-firm': (f) => ({ firmId: f.firmId }),
  'PUT /me/password': () => ({ currentPassword: 'not the current one', newPassword: 'probe password 123' }),
  'PATCH /members/:id': () => ({ role: 'stores' }),
  'POST /invitations': () => ({ email: uniqueEmail('probe-invitee'), role: 'engineer' }),
  'POST /invitations/by-token/:token/accept': () => ({ password: 'probe password 123', name: 'Probe' }),
  'POST /vans': () => ({
    name: `Probe van ${Math.random().toString(36).slice(2, 7)}`,
    registration: `PR${Math.floor(Math.random() * 90 + 10)} ${Math.random().toString(36).slice(2, 5).toUpperCase()}`,
  }),
  'PATCH /vans/:id': () => ({ notes: 'probe' }),
  'POST /depots': () => ({ name: `Probe depot ${Math.random().toString(36).slice(2, 7)}` }),
  'POST /item-kinds': () => ({
    name: `Probe kind ${Math.random().toString(36).slice(2, 7)}`,
    intervalDays: 30,
    intervalUses: null,
    dueSoonDays: 7,
    overduePolicy: 'block',
  }),
  'PATCH /item-kinds/:id': () => ({ dueSoonDays: 5 }),
  'POST /kits': () => ({ name: `Probe kit ${Math.random().toString(36).slice(2, 7)}` }),
  'PATCH /kits/:id': () => ({ notes: 'probe' }),
  'POST /kits/:id/check-out': (f) => ({ toLocationId: f.van.id }),
  'POST /kits/:id/check-in': (f) => ({ toLocationId: f.depotId, condition: 'in_service' }),
  'POST /kits/:id/move': (f) => ({ toLocationId: f.spareVanId }),
  'POST /kit-items': (f) => ({
    assetTag: `PRB-${Math.random().toString(36).slice(2, 8).toUpperCase()}`,
    kindId: f.kindId,
    kitId: f.kit.id,
  }),
  'PATCH /kit-items/:id': () => ({ notes: 'probe' }),
  'POST /kit-items/:id/check-out': (f) => ({ toLocationId: f.van.id }),
  'POST /kit-items/:id/check-in': (f) => ({ toLocationId: f.depotId, condition: 'in_service' }),
  'POST /kit-items/:id/move': (f) => ({ toLocationId: f.spareVanId }),
  'POST /kit-items/:id/inspections': (f) => ({ result: 'passed', photoId: f.photoId }),
  'POST /products': () => ({
    name: `Probe product ${Math.random().toString(36).slice(2, 7)}`,
    kind: 'inhibitor',
    packSize: 1,
    packUnit: 'l',
    doseLitresPer100L: 1,
  }),
  'PUT /products/:id': (f) => ({ name: f.product.name, kind: 'cleaner', packSize: 500, packUnit: 'ml' }),
  'POST /stock/receipts': (f) => ({
    locationId: f.depotId,
    lines: [{ productId: f.product.id, lotNumber: f.product.lotNumber, expiresOn: '2030-01-31', quantity: 1 }],
  }),
  'POST /stock/transfers': (f) => ({
    fromLocationId: f.depotId,
    toLocationId: f.van.id,
    lines: [{ productId: f.product.id, batchId: f.product.batchId, quantity: 1 }],
  }),
  'POST /stock/usages': (f) => ({ locationId: f.van.id, productId: f.product.id, quantity: 1, reason: 'Probe use' }),
  'POST /stock/stocktakes': (f) => ({ locationId: f.depotId, counts: [{ batchId: f.product.batchId, counted: 9 }] }),
  'POST /stock/write-offs': (f) => ({
    locationId: f.depotId,
    batchId: f.product.batchId,
    quantity: 1,
    reason: 'damaged',
  }),
  'POST /stock/movements/:id/reverse': () => ({ reason: 'Probe reversal' }),
  'PUT /par-levels': (f) => ({ locationId: f.van.id, productId: f.product.id, minimum: 1, target: 2 }),
  'POST /customers': () => ({ name: 'Probe customer' }),
  'POST /customers/:id/sites': () => ({ address: '1 Probe Street' }),
  'POST /jobs': (f) => ({
    siteId: f.siteId,
    scheduledOn: '2026-12-20',
    productIds: [f.product.id],
    survey: {
      systemType: 'sealed',
      boilerKind: 'combi',
      fuel: 'gas',
      radiators: [{ room: 'Hall', panel: 'double' }],
      pipeRuns: [],
    },
  }),
  // Every reason the guard could ask for, so the probe reaches the completion itself.
  'POST /jobs/:id/complete': () => ({
    confirmations: completionCodes.map((code) => ({ code, reason: 'Probe reason' })),
  }),
  'PATCH /jobs/:id': () => ({ scheduledOn: '2026-12-21' }),
  'POST /jobs/:id/cancel': () => ({ reason: 'Probe cancellation' }),
  'PUT /jobs/:id/flush-order': () => ({ radiatorIndexes: [0] }),
  'POST /jobs/:id/signatures': () => ({
    kind: 'acknowledgement',
    name: 'Probe Signer',
    imagePngDataUrl: `data:image/png;base64,${tinyPng.toString('base64')}`,
  }),
  'PUT /jobs/:id/steps/:step': () => ({ done: true }),
  'PUT /jobs/:id/radiators/:index/readings/:phase': () => ({
    topC: 62,
    bottomC: 41.5,
    flowC: 65,
    returnC: 55,
    roomC: 19,
  }),
  'PUT /jobs/:id/radiators/:index/agitation': () => ({ minutes: 5 }),
  'PUT /jobs/:id/radiators/:index/flushed': () => ({ done: true }),
  'PUT /jobs/:id/water-tests': () => ({ mainsTdsPpm: 180, systemTdsPpm: 190, waterClear: true, ph: 7.6 }),
  'PUT /jobs/:id/kit': () => ({ kitItemIds: [] }),
  'PUT /jobs/:id/notes': () => ({ notes: 'Probe note' }),
  'POST /stock/restock-run': (f) => ({
    lines: [{ toLocationId: f.van.id, productId: f.product.id, batchId: f.product.batchId, quantity: 1 }],
  }),
  'PUT /reminder-settings': () => ({ scanHour: 7, inspectionReminders: true, vanReminders: true }),
  'POST /marketing-suppressions': () => ({ email: 'probe-householder@example.test' }),
  // A fixed name: the isolation probe runs as firm B, so firm A's name here would leak into B's answers.
  'PUT /firm': () => ({
    name: 'Probe firm settings',
    address: '1 Probe Street',
    timeZone: 'Europe/London',
    volumeUnit: 'litres',
    coldBottomThresholdK: 10,
  }),
  'PUT /money/settings': () => ({
    vatRegistered: true,
    vatNumber: 'GB999999973',
    vatRateBp: 2000,
    paymentTermsDays: 14,
    quoteValidityDays: 30,
    firstReminderDays: 7,
    secondReminderDays: 21,
    invoiceOnCompletion: false,
  }),
  'POST /money/price-items': () => ({ kind: 'extra', name: 'Probe valve', unitPence: 1_200 }),
  'PUT /price-items/:id': () => ({
    kind: 'visit',
    name: 'Probe clean',
    visitKind: 'full_clean',
    pricing: 'bands',
    bands: [{ upToRadiators: 8, pricePence: 30_000 }],
  }),
  'POST /invoices': (f) => ({ jobId: f.jobId }),
  'PUT /invoices/:id/lines': () => ({
    lines: [{ kind: 'other', description: 'Probe line', quantity: 1, unitPence: 100 }],
  }),
  'POST /invoices/:id/credit-notes': () => ({ reason: 'Probe credit' }),
  'POST /quotes': (f) => ({
    jobId: f.jobId,
    lines: [{ kind: 'extra', description: 'Probe filter', quantity: 1, unitPence: 4_500 }],
  }),
  'PUT /quotes/:id': () => ({ lines: [{ kind: 'extra', description: 'Probe filter', quantity: 1, unitPence: 4_000 }] }),
  'POST /quotes/:id/accept': () => ({
    name: 'Probe Customer',
    agree: true,
    expressRequest: true,
    imagePngDataUrl: `data:image/png;base64,${tinyPng.toString('base64')}`,
  }),
  'POST /public/quotes/:token/accept': () => ({ name: 'Probe Customer', agree: true }),
  'POST /public/quotes/:token/decline': () => ({ reason: 'Probe' }),
  'POST /payments/:id/refunds': () => ({ amountPence: 100 }),
  'POST /pay/:token/checkout': () => ({ from: 'doorstep' }),
  'POST /sites/:id/checks': (f) => ({
    checkedOn: '2026-11-30',
    inhibitorProductId: f.product.id,
    inhibitorReading: 100,
  }),
};

/** Query strings per route, built from a firm's records. */
const queries: Record<string, (f: SeededFirm) => Record<string, string>> = {
  'GET /jobs': (f) => ({
    status: 'planned',
    engineerMemberId: String(f.people.engineer.memberId),
    from: '2026-01-01',
    to: '2027-12-31',
    sort: 'upcoming',
  }),
  'GET /customers': () => ({ q: 'Quarry' }),
  'GET /invoices': (f) => ({ status: 'issued', jobId: String(f.jobId) }),
  'GET /quotes': (f) => ({ jobId: String(f.jobId) }),
  'GET /money/export.csv': () => ({ from: '2026-11-01', to: '2026-12-31' }),
  'GET /kit-items': (f) => ({ kitId: String(f.kit.id), locationId: String(f.depotId), kindId: String(f.kindId) }),
  'GET /kit-items/labels': (f) => ({ kitId: String(f.kit.id) }),
  'GET /stock': () => ({ page: '1', limit: '25' }),
  'GET /stock/batches': (f) => ({ locationId: String(f.depotId), productId: String(f.product.id) }),
  'GET /stock/movements': (f) => ({ locationId: String(f.depotId), productId: String(f.product.id) }),
  'GET /stock/movements.csv': (f) => ({ productId: String(f.product.id) }),
  'GET /stock/restock-run': (f) => ({ depotId: String(f.depotId) }),
  'POST /stock/restock-run': (f) => ({ depotId: String(f.depotId) }),
  'GET /stock/reorder-list.csv': (f) => ({ depotId: String(f.depotId) }),
  'GET /stock/booked-jobs-short': (f) => ({ engineerMemberId: String(f.people.engineer.memberId) }),
  'GET /vibration/register': () => ({ weeks: '4' }),
};

export function probeQuery(route: RouteDefinition, firm: SeededFirm): string {
  if (!route.request.query) return '';
  const build = queries[routeKey(route)];
  if (!build)
    throw new Error(`The isolation harness has no sample query for ${routeKey(route)}: add one to route-probes.ts`);
  return `?${new URLSearchParams(build(firm)).toString()}`;
}

/** A tiny valid PNG (1x1), for upload routes. */
export const tinyPng = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==',
  'base64',
);

/** A minimal PDF (what a safety data sheet upload must be). */
export const tinyPdf = Buffer.from(
  '%PDF-1.4\n1 0 obj<</Type/Catalog/Pages 2 0 R>>endobj\n2 0 obj<</Type/Pages/Kids[]/Count 0>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n',
);

/** Multipart fields per upload route, built from a firm's records. */
const multipartFields: Record<string, (f: SeededFirm) => Record<string, string>> = {
  'POST /photos': (f) => ({ itemId: String(f.looseItemId) }),
  'POST /products/:id/safety-data-sheet': () => ({}),
  'POST /jobs/:id/photos': () => ({ tag: 'system', caption: 'Probe photo' }),
};

export function probeMultipart(route: RouteDefinition, firm: SeededFirm): Record<string, string> | undefined {
  if (!route.multipart) return undefined;
  const build = multipartFields[routeKey(route)];
  if (!build)
    throw new Error(
      `The isolation harness has no multipart fields for ${routeKey(route)}: add them to route-probes.ts`,
    );
  return build(firm);
}

export function probePath(route: RouteDefinition, firm: SeededFirm): string {
  const resource = route.path.split('/')[1] ?? '';
  return `/api${route.path.replace(/:([A-Za-z]+)/g, (_m, name: string) => {
    const fill = pathIds[`${resource}:${name}`];
    if (!fill)
      throw new Error(
        `The isolation harness does not know how to fill ${name} in ${routeKey(route)}: add it to route-probes.ts`,
      );
    return encodeURIComponent(fill(firm));
  })}`;
}

export function probeBody(route: RouteDefinition, firm: SeededFirm): unknown {
  if (!route.request.body) return undefined;
  const build = bodies[routeKey(route)];
  if (!build)
    throw new Error(`The isolation harness has no sample body for ${routeKey(route)}: add one to route-probes.ts`);
  return build(firm);
}

/** Calls a route as the client, filling path, query, body or upload from the firm's records. */
export function callProbe(client: Client, route: RouteDefinition, firm: SeededFirm) {
  const url = probePath(route, firm) + probeQuery(route, firm);
  const fields = probeMultipart(route, firm);
  if (fields && route.multipart) {
    const pdf = route.multipart.fileField === 'file';
    return client.upload(url, fields, {
      field: route.multipart.fileField,
      content: pdf ? tinyPdf : tinyPng,
      filename: pdf ? 'probe.pdf' : 'probe.png',
      contentType: pdf ? 'application/pdf' : 'image/png',
    });
  }
  if (route.method === 'get') return client.get(url);
  return client[route.method](url, probeBody(route, firm));
}
