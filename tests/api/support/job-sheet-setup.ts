import { expect } from 'vitest';
import { signIn, type Client, type TestApp } from './test-app.ts';
import { seedFirm, type SeededFirm } from './seed-firm.ts';
import { tinyPng } from './route-probes.ts';

export const COMPLETED = 'This job is completed; its record can no longer change.';

export const survey = {
  systemType: 'sealed',
  boilerKind: 'combi',
  fuel: 'gas',
  radiators: [
    // 10,000 W rated at dT 50 so the EN 442 factors show to four figures in whole watts.
    { room: 'Lounge', panel: 'double', heightMm: 600, lengthMm: 1400, ratedWatts: 10_000 },
    { room: 'Landing', panel: 'single', heightMm: 600, lengthMm: 800 },
  ],
  pipeRuns: [{ tube: '15', lengthM: 20 }],
};

export interface JobSheetSetup {
  firm: SeededFirm;
  engineer: Client;
  jobId: number;
  inhibitorId: number;
  /** A vibrating tool on the engineer's van, 10 m/s^2. */
  toolId: number;
}

/** A firm whose engineer has a booked job (two radiators, a cleaner and an inhibitor) and a tool on the van. */
export async function setUpJobSheet(t: TestApp, label: string): Promise<JobSheetSetup> {
  const firm = await seedFirm(t.deps.db, label);
  const db = t.deps.db;
  await db('products').where({ id: firm.product.id }).update({ min_circulation_minutes: 60 });
  const [inhibitorId] = (await db('products').insert({
    firm_id: firm.firmId,
    name: `${label} inhibitor ${firm.firmId}`,
    kind: 'inhibitor',
    pack_size_ml: 1000,
    dose_litres_per_100l: 1,
    target_min: 1,
    target_max: 1.5,
    target_unit: '% v/v',
  })) as number[];
  const [batchId] = (await db('product_batches').insert({
    firm_id: firm.firmId,
    product_id: inhibitorId,
    lot_number: `INH${firm.firmId}`,
    expires_on: '2030-06-30',
  })) as number[];
  await db('stock_movements').insert({
    firm_id: firm.firmId,
    group_id: `inh-${firm.firmId}`,
    kind: 'received',
    location_id: firm.van.id,
    product_id: inhibitorId,
    batch_id: batchId,
    quantity_delta: 3,
    by_user_id: firm.people.stores.userId,
  });
  await db('stock_balances').insert({
    firm_id: firm.firmId,
    location_id: firm.van.id,
    batch_id: batchId,
    product_id: inhibitorId,
    quantity: 3,
  });
  await db('kit_items').where({ id: firm.looseItemId }).update({ location_id: firm.van.id, vibration_ms2: 10 });
  const engineer = await signIn(t.app, firm.people.engineer.email);
  const res = await engineer.post('/api/jobs', {
    siteId: firm.siteId,
    scheduledOn: '2026-12-14',
    productIds: [firm.product.id, inhibitorId!],
    survey,
  });
  expect(res.status).toBe(201);
  return { firm, engineer, jobId: res.body.job.id as number, inhibitorId: inhibitorId!, toolId: firm.looseItemId };
}

export const minutes = (n: number) => n * 60_000;

/** Every write of the sheet, as [label, call]. */
export function writes(client: Client, s: JobSheetSetup, jobId = s.jobId) {
  return [
    ['step', () => client.put(`/api/jobs/${jobId}/steps/flush`, { done: true })],
    ['reading', () => client.put(`/api/jobs/${jobId}/radiators/0/readings/after`, { topC: 70, bottomC: 66 })],
    ['agitation', () => client.put(`/api/jobs/${jobId}/radiators/0/agitation`, { minutes: 5 })],
    ['flushed', () => client.put(`/api/jobs/${jobId}/radiators/0/flushed`, { done: true })],
    [
      'water',
      () => client.put(`/api/jobs/${jobId}/water-tests`, { mainsTdsPpm: 150, systemTdsPpm: 155, waterClear: true }),
    ],
    ['kit', () => client.put(`/api/jobs/${jobId}/kit`, { kitItemIds: [] })],
    ['notes', () => client.put(`/api/jobs/${jobId}/notes`, { notes: 'late note' })],
    [
      'photo',
      () =>
        client.upload(
          `/api/jobs/${jobId}/photos`,
          { tag: 'other' },
          { field: 'photo', content: tinyPng, filename: 'p.png', contentType: 'image/png' },
        ),
    ],
  ] as const;
}

export async function sheetRowCounts(t: TestApp, s: JobSheetSetup) {
  const where = { firm_id: s.firm.firmId, job_id: s.jobId };
  const counts = await Promise.all(
    [
      'job_steps',
      'job_radiator_readings',
      'job_agitations',
      'job_water_tests',
      'job_kit_items',
      'photos',
      'job_radiator_flushes',
    ].map((tb) => t.deps.db(tb).where(where).count({ n: '*' }).first()),
  );
  const job = await t.deps.db('jobs').where({ id: s.jobId }).first('notes');
  return { counts: counts.map((c) => Number((c as { n: number }).n)), notes: job.notes as string | null };
}
