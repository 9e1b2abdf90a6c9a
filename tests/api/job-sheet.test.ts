import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { jobSteps } from '@heatfleet/domain';
import { createTestApp, signIn, type Client, type TestApp } from './support/test-app.ts';
import { seedFirm, type SeededFirm } from './support/seed-firm.ts';
import { tinyPng, tinyPdf } from './support/route-probes.ts';

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

const COMPLETED = 'This job is completed; its record can no longer change.';

const survey = {
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

interface Setup {
  firm: SeededFirm;
  engineer: Client;
  jobId: number;
  inhibitorId: number;
  /** A vibrating tool on the engineer's van, 10 m/s^2. */
  toolId: number;
}

/** A firm whose engineer has a booked job (two radiators, a cleaner and an inhibitor) and a tool on the van. */
async function setUp(label: string): Promise<Setup> {
  const firm = await seedFirm(t.deps.db, label);
  const db = t.deps.db;
  await db('products').where({ id: firm.product.id }).update({ min_circulation_minutes: 60 });
  const [inhibitorId] = (await db('products').insert({
    firm_id: firm.firmId, name: `${label} inhibitor ${firm.firmId}`, kind: 'inhibitor', pack_size_ml: 1000, dose_litres_per_100l: 1, target_min: 1, target_max: 1.5, target_unit: '% v/v',
  })) as number[];
  const [batchId] = (await db('product_batches').insert({ firm_id: firm.firmId, product_id: inhibitorId, lot_number: `INH${firm.firmId}`, expires_on: '2030-06-30' })) as number[];
  await db('stock_movements').insert({ firm_id: firm.firmId, group_id: `inh-${firm.firmId}`, kind: 'received', location_id: firm.van.id, product_id: inhibitorId, batch_id: batchId, quantity_delta: 3, by_user_id: firm.people.stores.userId });
  await db('stock_balances').insert({ firm_id: firm.firmId, location_id: firm.van.id, batch_id: batchId, product_id: inhibitorId, quantity: 3 });
  await db('kit_items').where({ id: firm.looseItemId }).update({ location_id: firm.van.id, vibration_ms2: 10 });
  const engineer = await signIn(t.app, firm.people.engineer.email);
  const res = await engineer.post('/api/jobs', { siteId: firm.siteId, scheduledOn: '2026-12-14', productIds: [firm.product.id, inhibitorId!], survey });
  expect(res.status).toBe(201);
  return { firm, engineer, jobId: res.body.job.id as number, inhibitorId: inhibitorId!, toolId: firm.looseItemId };
}

const minutes = (n: number) => n * 60_000;

describe('the job sheet in GET /api/jobs/:id', () => {
  it('keeps the plan and adds the sheet: seven steps in order, the radiators of the survey, the firm threshold', async () => {
    const s = await setUp('sheet-read');
    const res = await s.engineer.get(`/api/jobs/${s.jobId}`).expect(200);
    expect(Object.keys(res.body)).toEqual(expect.arrayContaining(['job', 'survey', 'volume', 'doses', 'today', 'chemicalsUsed', 'sheet']));
    const sheet = res.body.sheet;
    expect(sheet.editable).toBe(true);
    expect(sheet.steps.map((x: { step: string }) => x.step)).toEqual([...jobSteps]);
    expect(sheet.steps.every((x: { doneAt: null }) => x.doneAt === null)).toBe(true);
    // DEFAULT_COLD_BOTTOM_THRESHOLD_K, common practice (no source).
    expect(sheet.coldBottomThresholdK).toBe(10);
    expect(sheet.circulation).toEqual({ minimumMinutes: 60, startedAt: null, elapsedMinutes: null, met: false });
    expect(sheet.radiators).toEqual([
      expect.objectContaining({ index: 0, room: 'Lounge', panel: 'double', ratedWatts: 10_000, before: null, after: null, agitation: null }),
      expect.objectContaining({ index: 1, room: 'Landing', ratedWatts: null }),
    ]);
    expect(sheet.kitOnVan).toEqual([expect.objectContaining({ id: s.toolId, vibrationMs2: 10 })]);
    expect(sheet).toMatchObject({ kitUsed: [], photos: [], notes: '', hav: { points: 0, level: 'low' } });
    expect(sheet.hav.engineerName).toContain('engineer');
  });

  it('is not editable for another engineer, who may read it', async () => {
    const s = await setUp('sheet-other');
    const other = await signIn(t.app, s.firm.target.email);
    const res = await other.get(`/api/jobs/${s.jobId}`).expect(200);
    expect(res.body.sheet.editable).toBe(false);
  });
});

describe('steps', () => {
  it('a tick records the time and who; a second tick keeps the first time; clearing removes it', async () => {
    const s = await setUp('steps');
    const first = await s.engineer.put(`/api/jobs/${s.jobId}/steps/isolate_connect`, { done: true });
    expect(first.status).toBe(200);
    const step = first.body.sheet.steps[0];
    expect(step).toMatchObject({ step: 'isolate_connect', label: expect.any(String), doneByName: expect.stringContaining('engineer') });
    t.clock.advance(minutes(2));
    const again = await s.engineer.put(`/api/jobs/${s.jobId}/steps/isolate_connect`, { done: true });
    expect(again.body.sheet.steps[0].doneAt).toBe(step.doneAt);
    const cleared = await s.engineer.put(`/api/jobs/${s.jobId}/steps/isolate_connect`, { done: false });
    expect(cleared.body.sheet.steps[0]).toMatchObject({ doneAt: null, doneByName: null });
    expect((await s.engineer.put(`/api/jobs/${s.jobId}/steps/sing_a_song`, { done: true })).status).toBe(422);
  });

  it('times the hot circulation from the cleaner dose against the cleaner\u2019s minimum', async () => {
    const s = await setUp('circulation');
    expect((await s.engineer.put(`/api/jobs/${s.jobId}/steps/dose_cleaner`, { done: true })).status).toBe(200);
    t.clock.advance(minutes(45));
    const running = (await s.engineer.get(`/api/jobs/${s.jobId}`)).body.sheet.circulation;
    expect(running).toMatchObject({ minimumMinutes: 60, elapsedMinutes: 45, met: false });
    t.clock.advance(minutes(16));
    const done = await s.engineer.put(`/api/jobs/${s.jobId}/steps/circulate_hot`, { done: true });
    expect(done.body.sheet.circulation).toMatchObject({ elapsedMinutes: 61, met: true });
    // Once ticked, the time stops at the tick.
    t.clock.advance(minutes(30));
    expect((await s.engineer.get(`/api/jobs/${s.jobId}`)).body.sheet.circulation.elapsedMinutes).toBe(61);
  });
});

describe('radiator readings', () => {
  it('computes the EN 442 output at the measured dT: factor 0.5148 at dT 30, 1.2675 at dT 60 (PRODUCT.md)', async () => {
    const s = await setUp('readings');
    // Flow 55, return 45, room 20: dT = 50 - 20 = 30 K.
    const before = await s.engineer.put(`/api/jobs/${s.jobId}/radiators/0/readings/before`, { topC: 58, bottomC: 40, flowC: 55, returnC: 45, roomC: 20 });
    expect(before.status).toBe(200);
    const r0 = before.body.sheet.radiators[0].before;
    expect(r0).toMatchObject({ topC: 58, bottomC: 40, differenceK: 18, deltaTK: 30, deltaTFrom: 'flow_return', coldBottom: true });
    expect(Math.abs(r0.outputWatts - 5148)).toBeLessThanOrEqual(1);
    // Flow 85, return 75, room 20: dT 60 K.
    const after = await s.engineer.put(`/api/jobs/${s.jobId}/radiators/0/readings/after`, { topC: 84, bottomC: 78, flowC: 85, returnC: 75, roomC: 20 });
    const r1 = after.body.sheet.radiators[0].after;
    expect(r1).toMatchObject({ differenceK: 6, deltaTK: 60, coldBottom: false });
    expect(Math.abs(r1.outputWatts - 12_675)).toBeLessThanOrEqual(1);
    // At the rating point 75/65/20 (dT 50) the output is the rated output; the room not taken stays "not taken", the 20 °C rating room is used.
    const rated = await s.engineer.put(`/api/jobs/${s.jobId}/radiators/0/readings/after`, { topC: 75, bottomC: 65, flowC: 75, returnC: 65 });
    expect(rated.body.sheet.radiators[0].after).toMatchObject({ deltaTK: 50, roomC: null, roomUsedC: 20, outputWatts: 10_000 });
    // No rated output on the survey: no watts, but the difference and the flag.
    const landing = await s.engineer.put(`/api/jobs/${s.jobId}/radiators/1/readings/before`, { topC: 60, bottomC: 49.5 });
    expect(landing.body.sheet.radiators[1].before).toMatchObject({ differenceK: 10.5, coldBottom: true, outputWatts: null, deltaTFrom: 'surfaces' });
  });

  it('flags a cold bottom against the firm\u2019s own threshold', async () => {
    const s = await setUp('threshold');
    await t.deps.db('firms').where({ id: s.firm.firmId }).update({ cold_bottom_threshold_k: 20 });
    const res = await s.engineer.put(`/api/jobs/${s.jobId}/radiators/0/readings/before`, { topC: 60, bottomC: 45 });
    expect(res.body.sheet.coldBottomThresholdK).toBe(20);
    expect(res.body.sheet.radiators[0].before.coldBottom).toBe(false);
  });

  it('refuses a radiator not on the survey (404) and a reading out of range (422), storing nothing', async () => {
    const s = await setUp('readings-bad');
    const missing = await s.engineer.put(`/api/jobs/${s.jobId}/radiators/2/readings/before`, { topC: 60, bottomC: 45 });
    expect(missing.status).toBe(404);
    expect(missing.body.message).toBe('That radiator is not on this job\u2019s survey.');
    const hot = await s.engineer.put(`/api/jobs/${s.jobId}/radiators/0/readings/before`, { topC: 160, bottomC: 45 });
    expect(hot.status).toBe(422);
    expect(hot.body.message).toContain('Top temperature');
    expect((await s.engineer.put(`/api/jobs/${s.jobId}/radiators/0/readings/during`, { topC: 60, bottomC: 45 })).status).toBe(422);
    expect(await t.deps.db('job_radiator_readings').where({ firm_id: s.firm.firmId })).toHaveLength(0);
  });
});

describe('flushed radiator by radiator', () => {
  it('a tick records when each radiator was flushed until clear; a second tick keeps the first time; clearing removes it', async () => {
    const s = await setUp('flushed');
    const first = await s.engineer.put(`/api/jobs/${s.jobId}/radiators/1/flushed`, { done: true });
    expect(first.status).toBe(200);
    const at = first.body.sheet.radiators[1].flushedAt as string;
    expect(Math.abs(Date.parse(at) - t.clock.now().getTime())).toBeLessThan(5_000);
    expect(first.body.sheet.radiators[0].flushedAt).toBeNull();
    t.clock.advance(minutes(3));
    expect((await s.engineer.put(`/api/jobs/${s.jobId}/radiators/1/flushed`, { done: true })).body.sheet.radiators[1].flushedAt).toBe(at);
    expect((await s.engineer.put(`/api/jobs/${s.jobId}/radiators/1/flushed`, { done: false })).body.sheet.radiators[1].flushedAt).toBeNull();
    const off = await s.engineer.put(`/api/jobs/${s.jobId}/radiators/9/flushed`, { done: true });
    expect(off.status).toBe(404);
    expect(off.body.message).toBe('That radiator is not on this job\u2019s survey.');
    expect((await s.engineer.put(`/api/jobs/${s.jobId}/radiators/0/flushed`, { done: 'yes' })).status).toBe(422);
    expect(await t.deps.db('job_radiator_flushes').where({ firm_id: s.firm.firmId, job_id: s.jobId }).count({ n: '*' }).first()).toEqual({ n: 0 });
  });
});

describe('agitation and the hand-arm vibration day', () => {
  it('HSE points: 10 m/s\u00b2 for 30 min is 100, 5 m/s\u00b2 for 3 h is 150; the day sums both jobs of the engineer', async () => {
    const s = await setUp('hav');
    const first = await s.engineer.put(`/api/jobs/${s.jobId}/radiators/0/agitation`, { minutes: 30, kitItemId: s.toolId });
    expect(first.status).toBe(200);
    // points = 2 x a^2 x hours (HSE points system, Control of Vibration at Work Regulations 2005).
    expect(first.body.sheet.radiators[0].agitation).toMatchObject({ minutes: 30, kitItemId: s.toolId, magnitudeMs2: 10, points: 100 });
    expect(first.body.sheet.hav).toMatchObject({ points: 100, level: 'above_action' });

    // A second job of the same engineer, the same day, with a gentler tool.
    const [softId] = (await t.deps.db('kit_items').insert({
      firm_id: s.firm.firmId, kind_id: s.firm.kindId, asset_tag: `SOFT${s.firm.firmId}`, location_id: s.firm.van.id, in_service_since: '2026-11-01', vibration_ms2: 5,
    })) as number[];
    const second = await s.engineer.post('/api/jobs', { siteId: s.firm.siteId, scheduledOn: '2026-12-14', productIds: [], survey });
    const secondId = second.body.job.id as number;
    const other = await s.engineer.put(`/api/jobs/${secondId}/radiators/1/agitation`, { minutes: 180, kitItemId: softId });
    expect(other.body.sheet.radiators[1].agitation.points).toBe(150);
    expect(other.body.sheet.hav).toMatchObject({ points: 250, level: 'above_action' });
    const back = await s.engineer.get(`/api/jobs/${s.jobId}`);
    expect(back.body.sheet.hav.points).toBe(250);
    expect(back.body.sheet.hav.message).toContain('exposure action value of 100');

    // The magnitude is a snapshot: changing the kit setting later leaves the record as it was.
    await t.deps.db('kit_items').where({ id: s.toolId }).update({ vibration_ms2: 2 });
    expect((await s.engineer.get(`/api/jobs/${s.jobId}`)).body.sheet.radiators[0].agitation.magnitudeMs2).toBe(10);
  });

  it('refuses a tool that is not on the job\u2019s van (422) and a radiator not on the survey (404)', async () => {
    const s = await setUp('hav-bad');
    await t.deps.db('kit_items').where({ id: s.toolId }).update({ location_id: s.firm.depotId });
    const away = await s.engineer.put(`/api/jobs/${s.jobId}/radiators/0/agitation`, { minutes: 10, kitItemId: s.toolId });
    expect(away.status).toBe(422);
    expect(away.body.message).toContain('not on this job\u2019s van');
    expect((await s.engineer.put(`/api/jobs/${s.jobId}/radiators/5/agitation`, { minutes: 10 })).status).toBe(404);
    expect((await s.engineer.put(`/api/jobs/${s.jobId}/radiators/0/agitation`, { minutes: 300 })).status).toBe(422);
    expect(await t.deps.db('job_agitations').where({ firm_id: s.firm.firmId })).toHaveLength(0);
    // Time without a known tool counts no points (the magnitude is unknown), but is kept.
    const bare = await s.engineer.put(`/api/jobs/${s.jobId}/radiators/0/agitation`, { minutes: 10 });
    expect(bare.body.sheet.radiators[0].agitation).toMatchObject({ minutes: 10, kitItemId: null, magnitudeMs2: null, points: 0 });
  });
});

describe('water tests', () => {
  it('flush complete when the system TDS is within 10% of mains and the water is clear (BS 7593 as commonly quoted; the standard\u2019s text not seen)', async () => {
    const s = await setUp('water');
    const put = (body: object) => s.engineer.put(`/api/jobs/${s.jobId}/water-tests`, body);
    const ok = await put({ mainsTdsPpm: 200, systemTdsPpm: 215, waterClear: true, inhibitorReading: 1.2, inhibitorProductId: s.inhibitorId, ph: 7.8 });
    expect(ok.status).toBe(200);
    expect(ok.body.sheet.water).toMatchObject({ mainsTdsPpm: 200, systemTdsPpm: 215, waterClear: true, inhibitorReading: 1.2, inhibitorProductId: s.inhibitorId, ph: 7.8 });
    // |215 - 200| / 200 = 7.5%.
    expect(ok.body.sheet.water.figures.flush).toEqual({ complete: true, withinPercent: 7.5 });
    // 1.2 within the product's target 1 to 1.5 % v/v.
    expect(ok.body.sheet.water.figures.inhibitor).toEqual({ result: 'pass', min: 1, max: 1.5, unit: '% v/v' });
    const far = await put({ mainsTdsPpm: 200, systemTdsPpm: 225, waterClear: true, inhibitorReading: 0.8, inhibitorProductId: s.inhibitorId });
    // 12.5% from mains: not yet.
    expect(far.body.sheet.water.figures.flush).toEqual({ complete: false, withinPercent: 12.5 });
    expect(far.body.sheet.water.figures.inhibitor.result).toBe('low');
    // A PUT is the whole set: pH left out is cleared.
    expect(far.body.sheet.water.ph).toBeNull();
    const cloudy = await put({ mainsTdsPpm: 200, systemTdsPpm: 200, waterClear: false });
    expect(cloudy.body.sheet.water.figures.flush.complete).toBe(false);
    // No product named: the reading is judged against the job's planned inhibitor.
    const planned = await put({ inhibitorReading: 1.6 });
    expect(planned.body.sheet.water.figures).toMatchObject({ flush: null, inhibitor: { result: 'high' } });
  });

  it('refuses a product that is not one of the firm\u2019s inhibitors (422) and a pH over 14', async () => {
    const s = await setUp('water-bad');
    const cleaner = await s.engineer.put(`/api/jobs/${s.jobId}/water-tests`, { inhibitorReading: 1.2, inhibitorProductId: s.firm.product.id });
    expect(cleaner.status).toBe(422);
    expect(cleaner.body.message).toContain('not one of the firm\u2019s inhibitors');
    expect((await s.engineer.put(`/api/jobs/${s.jobId}/water-tests`, { ph: 15 })).body.message).toContain('pH');
    expect(await t.deps.db('job_water_tests').where({ firm_id: s.firm.firmId })).toHaveLength(0);
  });
});

describe('kit used, notes and photos', () => {
  it('records the kit used as a set of items on the van, and refuses one that is not there', async () => {
    const s = await setUp('kit');
    const res = await s.engineer.put(`/api/jobs/${s.jobId}/kit`, { kitItemIds: [s.toolId, s.toolId] });
    expect(res.status).toBe(200);
    expect(res.body.sheet.kitUsed).toEqual([expect.objectContaining({ id: s.toolId, kindName: 'Hose set', kitName: null })]);
    const atDepot = s.firm.kit.itemIds[0]!;
    const refused = await s.engineer.put(`/api/jobs/${s.jobId}/kit`, { kitItemIds: [s.toolId, atDepot] });
    expect(refused.status).toBe(422);
    expect(refused.body.message).toContain('not on this job\u2019s van');
    expect((await s.engineer.put(`/api/jobs/${s.jobId}/kit`, { kitItemIds: [999_999_999] })).status).toBe(422);
    // Already listed, it may stay after leaving the van.
    await t.deps.db('kit_items').where({ id: s.toolId }).update({ location_id: s.firm.depotId });
    expect((await s.engineer.put(`/api/jobs/${s.jobId}/kit`, { kitItemIds: [s.toolId] })).status).toBe(200);
    const cleared = await s.engineer.put(`/api/jobs/${s.jobId}/kit`, { kitItemIds: [] });
    expect(cleared.body.sheet.kitUsed).toEqual([]);
  });

  it('keeps the notes, trimmed and bounded', async () => {
    const s = await setUp('notes');
    const res = await s.engineer.put(`/api/jobs/${s.jobId}/notes`, { notes: '  Magnets heavy with sludge on the first pass.  ' });
    expect(res.body.sheet.notes).toBe('Magnets heavy with sludge on the first pass.');
    expect((await s.engineer.put(`/api/jobs/${s.jobId}/notes`, { notes: 'x'.repeat(4001) })).status).toBe(422);
  });

  it('stores a tagged photo under the firm and serves it to the firm; refuses a non-image or a bad tag, leaving no row', async () => {
    const s = await setUp('photos');
    const up = await s.engineer.upload(`/api/jobs/${s.jobId}/photos`, { tag: 'magnet_before', caption: 'Before' }, { field: 'photo', content: tinyPng, filename: 'magnet.png', contentType: 'image/png' });
    expect(up.status).toBe(201);
    expect(up.body.photo).toMatchObject({ tag: 'magnet_before', caption: 'Before', url: `/api/photos/${up.body.photo.id}/content` });
    const row = await t.deps.db('photos').where({ id: up.body.photo.id }).first();
    expect(row).toMatchObject({ firm_id: s.firm.firmId, job_id: s.jobId, tag: 'magnet_before' });
    expect(row.object_key.startsWith(`firms/${s.firm.firmId}/photos/`)).toBe(true);
    const sheet = (await s.engineer.get(`/api/jobs/${s.jobId}`)).body.sheet;
    expect(sheet.photos).toEqual([expect.objectContaining({ id: up.body.photo.id, tag: 'magnet_before', caption: 'Before' })]);
    const img = await s.engineer.get(up.body.photo.url);
    expect(img.status).toBe(200);
    expect(img.headers['content-type']).toBe('image/png');

    const pdf = await s.engineer.upload(`/api/jobs/${s.jobId}/photos`, { tag: 'system' }, { field: 'photo', content: tinyPdf, filename: 'x.png', contentType: 'image/png' });
    expect(pdf.status).toBe(422);
    const badTag = await s.engineer.upload(`/api/jobs/${s.jobId}/photos`, { tag: 'selfie' }, { field: 'photo', content: tinyPng, filename: 'x.png', contentType: 'image/png' });
    expect(badTag.status).toBe(422);
    expect(await t.deps.db('photos').where({ firm_id: s.firm.firmId, job_id: s.jobId })).toHaveLength(1);
  });
});

/** Every write of the sheet, as [label, call]. */
function writes(client: Client, s: Setup, jobId = s.jobId) {
  return [
    ['step', () => client.put(`/api/jobs/${jobId}/steps/flush`, { done: true })],
    ['reading', () => client.put(`/api/jobs/${jobId}/radiators/0/readings/after`, { topC: 70, bottomC: 66 })],
    ['agitation', () => client.put(`/api/jobs/${jobId}/radiators/0/agitation`, { minutes: 5 })],
    ['flushed', () => client.put(`/api/jobs/${jobId}/radiators/0/flushed`, { done: true })],
    ['water', () => client.put(`/api/jobs/${jobId}/water-tests`, { mainsTdsPpm: 150, systemTdsPpm: 155, waterClear: true })],
    ['kit', () => client.put(`/api/jobs/${jobId}/kit`, { kitItemIds: [] })],
    ['notes', () => client.put(`/api/jobs/${jobId}/notes`, { notes: 'late note' })],
    ['photo', () => client.upload(`/api/jobs/${jobId}/photos`, { tag: 'other' }, { field: 'photo', content: tinyPng, filename: 'p.png', contentType: 'image/png' })],
  ] as const;
}

async function sheetRowCounts(s: Setup) {
  const where = { firm_id: s.firm.firmId, job_id: s.jobId };
  const counts = await Promise.all(['job_steps', 'job_radiator_readings', 'job_agitations', 'job_water_tests', 'job_kit_items', 'photos', 'job_radiator_flushes'].map((tb) => t.deps.db(tb).where(where).count({ n: '*' }).first()));
  const job = await t.deps.db('jobs').where({ id: s.jobId }).first('notes');
  return { counts: counts.map((c) => Number((c as { n: number }).n)), notes: job.notes as string | null };
}

describe('who may write, and when', () => {
  it('another engineer of the firm is refused (403) on every write; another firm gets 404', async () => {
    const s = await setUp('writes-who');
    const other = await signIn(t.app, s.firm.target.email);
    for (const [label, call] of writes(other, s)) expect((await call()).status, label).toBe(403);
    const stranger = await seedFirm(t.deps.db, 'writes-stranger');
    const owner = await signIn(t.app, stranger.people.owner.email);
    for (const [label, call] of writes(owner, s)) expect((await call()).status, label).toBe(404);
    expect((await sheetRowCounts(s)).counts).toEqual([0, 0, 0, 0, 0, 0, 0]);
    // The office may write an engineer's sheet.
    const stores = await signIn(t.app, s.firm.people.stores.email);
    expect((await stores.put(`/api/jobs/${s.jobId}/notes`, { notes: 'office note' })).status).toBe(200);
  });

  it('once completed, every write answers 409 in plain words and nothing changes; the sheet is read-only', async () => {
    const s = await setUp('writes-done');
    expect((await s.engineer.put(`/api/jobs/${s.jobId}/notes`, { notes: 'before completion' })).status).toBe(200);
    await s.engineer.post(`/api/jobs/${s.jobId}/complete`, {}).then((r) => expect(r.status).toBe(200));
    const before = await sheetRowCounts(s);
    for (const [label, call] of writes(s.engineer, s)) {
      const res = await call();
      expect(res.status, label).toBe(409);
      expect(res.body.message, label).toBe(COMPLETED);
    }
    expect(await sheetRowCounts(s)).toEqual(before);
    expect((await s.engineer.get(`/api/jobs/${s.jobId}`)).body.sheet.editable).toBe(false);
  });

  it('a write waiting on a completion that holds the job\u2019s lock is refused once it commits', async () => {
    const s = await setUp('writes-race');
    const trx = await t.deps.db.transaction();
    try {
      await trx('jobs').where({ firm_id: s.firm.firmId, id: s.jobId }).forUpdate().first('id');
      const pending = s.engineer.put(`/api/jobs/${s.jobId}/notes`, { notes: 'racing note' });
      await new Promise((r) => setTimeout(r, 400));
      await trx('jobs').where({ firm_id: s.firm.firmId, id: s.jobId }).update({ status: 'completed', completed_at: new Date() });
      await trx.commit();
      const res = await pending;
      expect(res.status).toBe(409);
      expect(res.body.message).toBe(COMPLETED);
    } finally {
      if (!trx.isCompleted()) await trx.rollback();
    }
    expect((await t.deps.db('jobs').where({ id: s.jobId }).first('notes')).notes).toBeNull();
  });

  it('a photo whose upload waits on a completion is refused, and its stored object is removed again', async () => {
    const s = await setUp('photo-race');
    const store = t.deps.objectStore;
    const put: string[] = [];
    const removed: string[] = [];
    const original = { put: store.put.bind(store), delete: store.delete.bind(store) };
    store.put = async (key, body, type) => {
      put.push(key);
      return original.put(key, body, type);
    };
    store.delete = async (key) => {
      removed.push(key);
      return original.delete(key);
    };
    const trx = await t.deps.db.transaction();
    try {
      await trx('jobs').where({ firm_id: s.firm.firmId, id: s.jobId }).forUpdate().first('id');
      const pending = s.engineer.upload(`/api/jobs/${s.jobId}/photos`, { tag: 'system' }, { field: 'photo', content: tinyPng, filename: 'p.png', contentType: 'image/png' });
      await new Promise((r) => setTimeout(r, 400));
      await trx('jobs').where({ firm_id: s.firm.firmId, id: s.jobId }).update({ status: 'completed', completed_at: new Date() });
      await trx.commit();
      const res = await pending;
      expect(res.status).toBe(409);
      expect(res.body.message).toBe(COMPLETED);
    } finally {
      if (!trx.isCompleted()) await trx.rollback();
      store.put = original.put;
      store.delete = original.delete;
    }
    expect(put).toHaveLength(1);
    expect(put[0]!.startsWith(`firms/${s.firm.firmId}/photos/`)).toBe(true);
    expect(removed).toEqual(put);
    expect(await t.deps.db('photos').where({ firm_id: s.firm.firmId, job_id: s.jobId })).toHaveLength(0);
  });

  it('writes sent together with the completion land before it or not at all', async () => {
    const s = await setUp('writes-together');
    const sent = writes(s.engineer, s);
    const [completion, ...answers] = await Promise.all([s.engineer.post(`/api/jobs/${s.jobId}/complete`, {}), ...sent.map(([, call]) => call())]);
    expect(completion.status).toBe(200);
    const job = await t.deps.db('jobs').where({ id: s.jobId }).first('completed_at', 'notes');
    const steps = await t.deps.db('job_steps').where({ firm_id: s.firm.firmId, job_id: s.jobId });
    for (const [i, res] of answers.entries()) expect([200, 201, 409], sent[i]![0]).toContain(res.status);
    // A write that answered 409 left nothing; one that landed did so before the completion.
    const notesAnswer = answers[5]!;
    expect(job.notes).toBe(notesAnswer.status === 200 ? 'late note' : null);
    for (const st of steps) expect(new Date(st.done_at).getTime()).toBeLessThanOrEqual(new Date(job.completed_at).getTime());
    expect(steps).toHaveLength(answers[0]!.status === 200 ? 1 : 0);
  });
});

describe('completion sets the next check 12 calendar months on', () => {
  it('from 15 January 2028 to 15 January 2029 (addMonths; 365 days would give the 14th across the leap day)', async () => {
    const app = createTestApp();
    try {
      app.clock.advance(Date.parse('2028-01-15T12:00:00Z') - Date.now());
      const firm = await seedFirm(app.deps.db, 'next-check');
      const engineer = await signIn(app.app, firm.people.engineer.email);
      const res = await engineer.post(`/api/jobs/${firm.jobId}/complete`, {});
      expect(res.status).toBe(200);
      expect(res.body.job.nextCheckOn).toBe('2029-01-15');
      expect((await app.deps.db('sites').where({ id: firm.siteId }).first('next_check_on')).next_check_on).toBe('2029-01-15');
    } finally {
      await app.close();
    }
  });
});

/** A 1x1 WebP: stored and listed in the report by its caption, since pdfkit cannot draw WebP. */
const tinyWebp = Buffer.from('UklGRiIAAABXRUJQVlA4IBYAAAAwAQCdASoBAAEADsD+JaQAA3AAAAAA', 'base64');

describe('the completion report with the job sheet', () => {
  it('holds the radiator table figures, the agitation and HAV points, the water test results, kit, steps, notes, photos and the next check date', async () => {
    const { PDFParse } = await import('pdf-parse');
    const s = await setUp('sheet-report');
    const e = s.engineer;
    const ok = (res: { status: number }) => expect(res.status).toBeLessThan(300);
    for (const step of jobSteps) ok(await e.put(`/api/jobs/${s.jobId}/steps/${step}`, { done: true }));
    // Lounge: a cold bottom before (diff 18 K > 10), cleared after (diff 6); dT 30 then dT 60 (EN 442 factors 0.5148, 1.2675).
    ok(await e.put(`/api/jobs/${s.jobId}/radiators/0/readings/before`, { topC: 58, bottomC: 40, flowC: 55, returnC: 45, roomC: 20 }));
    ok(await e.put(`/api/jobs/${s.jobId}/radiators/0/readings/after`, { topC: 84, bottomC: 78, flowC: 85, returnC: 75, roomC: 20 }));
    ok(await e.put(`/api/jobs/${s.jobId}/radiators/1/readings/before`, { topC: 61.5, bottomC: 47.5 }));
    // 10 m/s^2 for 30 minutes: 100 HSE points.
    ok(await e.put(`/api/jobs/${s.jobId}/radiators/0/agitation`, { minutes: 30, kitItemId: s.toolId }));
    ok(await e.put(`/api/jobs/${s.jobId}/radiators/0/flushed`, { done: true }));
    ok(await e.put(`/api/jobs/${s.jobId}/water-tests`, { mainsTdsPpm: 200, systemTdsPpm: 215, waterClear: true, inhibitorReading: 1.2, inhibitorProductId: s.inhibitorId, ph: 7.8 }));
    ok(await e.put(`/api/jobs/${s.jobId}/kit`, { kitItemIds: [s.toolId] }));
    ok(await e.put(`/api/jobs/${s.jobId}/notes`, { notes: 'Magnet heavy on the first pass; customer shown the sludge.' }));
    ok(await e.upload(`/api/jobs/${s.jobId}/photos`, { tag: 'magnet_before', caption: 'First pass' }, { field: 'photo', content: tinyPng, filename: 'm.png', contentType: 'image/png' }));
    ok(await e.upload(`/api/jobs/${s.jobId}/photos`, { tag: 'test_result', caption: 'Refractometer' }, { field: 'photo', content: tinyWebp, filename: 'r.webp', contentType: 'image/webp' }));
    const done = await e.post(`/api/jobs/${s.jobId}/complete`, {});
    expect(done.status).toBe(200);
    const nextCheckOn = done.body.job.nextCheckOn as string;

    const res = await e.get(`/api/jobs/${s.jobId}/report.pdf`).buffer(true).parse((r, cb) => {
      const parts: Buffer[] = [];
      r.on('data', (c: Buffer) => parts.push(c));
      r.on('end', () => cb(null, Buffer.concat(parts)));
    });
    expect(res.status).toBe(200);
    const text = (await new PDFParse({ data: new Uint8Array(res.body as Buffer) }).getText()).text.replace(/\s+/g, ' ');
    // The radiator table: room, before top/bottom/diff, after top/bottom/diff, cold bottom, output W, agitation.
    expect(text).toContain('Before top');
    expect(text).toMatch(/Lounge 58\.0 40\.0 18\.0 84\.0 78\.0 6\.0 yes \/ no 5148 \/ 12675 30/);
    expect(text).toMatch(/Landing 61\.5 47\.5 14\.0 - - - yes \/ - - \/ - -/);
    expect(text).toContain('100 hand-arm vibration points on this visit');
    expect(text).toMatch(/Flushed until clear: Lounge \d+ \w+, \d\d:\d\d \(1 not recorded\)/);
    // Water tests: |215 - 200| / 200 = 7.5% (within 10% and clear: BS 7593 as commonly quoted); 1.2 in 1 to 1.5 % v/v.
    expect(text).toContain('Flush complete: PASS (system within 7.5% of mains');
    expect(text).toContain('Inhibitor: PASS: reading 1.2 % v/v against the product\u2019s target 1 to 1.5 % v/v');
    expect(text).toContain('pH: 7.8');
    expect(text).toContain(`Next inhibitor check due: ${nextCheckOn}`);
    expect(text).toContain('Hot circulation:');
    expect(text).toContain('Dose the cleaner');
    expect(text).toContain('Magnet heavy on the first pass');
    expect(text).toContain('Hose set');
    expect(text).toContain('Filter magnet before: First pass');
    expect(text).toContain('Test result: Refractometer (WebP photo');
    expect(text).toContain('Gas Safe Register');
    expect(text).toContain('support your judgement');
  });
});

describe('the two settings the sheet reads', () => {
  it('a kit item\u2019s vibration magnitude and a cleaner\u2019s minimum circulation time are edited by the office and shown back', async () => {
    const firm = await seedFirm(t.deps.db, 'sheet-settings');
    const stores = await signIn(t.app, firm.people.stores.email);
    const item = await stores.patch(`/api/kit-items/${firm.looseItemId}`, { vibrationMs2: 8.5 });
    expect(item.status).toBe(200);
    expect(item.body.item.vibrationMs2).toBe(8.5);
    expect((await stores.get(`/api/kit-items/${firm.looseItemId}`)).body.item.vibrationMs2).toBe(8.5);
    expect((await stores.patch(`/api/kit-items/${firm.looseItemId}`, { vibrationMs2: -1 })).status).toBe(422);
    expect((await stores.patch(`/api/kit-items/${firm.looseItemId}`, { vibrationMs2: null })).body.item.vibrationMs2).toBeNull();

    const product = await stores.put(`/api/products/${firm.product.id}`, { name: firm.product.name, kind: 'cleaner', packSize: 1, packUnit: 'l', minCirculationMinutes: 60 });
    expect(product.status).toBe(200);
    expect(product.body.product.minCirculationMinutes).toBe(60);
    expect((await stores.get(`/api/products/${firm.product.id}`)).body.product.minCirculationMinutes).toBe(60);
    expect((await stores.put(`/api/products/${firm.product.id}`, { name: firm.product.name, kind: 'cleaner', packSize: 1, packUnit: 'l', minCirculationMinutes: 0 })).status).toBe(422);
    const engineer = await signIn(t.app, firm.people.engineer.email);
    expect((await engineer.patch(`/api/kit-items/${firm.looseItemId}`, { vibrationMs2: 3 })).status).toBe(403);
  });
});
