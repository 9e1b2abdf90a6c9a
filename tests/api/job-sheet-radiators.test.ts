import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from './support/test-app.ts';
import { minutes, setUpJobSheet, survey } from './support/job-sheet-setup.ts';

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

describe('radiator readings', () => {
  it('computes the EN 442 output at the measured dT: factor 0.5148 at dT 30, 1.2675 at dT 60', async () => {
    const s = await setUpJobSheet(t, 'readings');
    // Flow 55, return 45, room 20: dT = 50 - 20 = 30 K.
    const before = await s.engineer.put(`/api/jobs/${s.jobId}/radiators/0/readings/before`, {
      topC: 58,
      bottomC: 40,
      flowC: 55,
      returnC: 45,
      roomC: 20,
    });
    expect(before.status).toBe(200);
    const r0 = before.body.sheet.radiators[0].before;
    expect(r0).toMatchObject({
      topC: 58,
      bottomC: 40,
      differenceK: 18,
      deltaTK: 30,
      deltaTFrom: 'flow_return',
      coldBottom: true,
    });
    expect(Math.abs(r0.outputWatts - 5148)).toBeLessThanOrEqual(1);
    // Flow 85, return 75, room 20: dT 60 K.
    const after = await s.engineer.put(`/api/jobs/${s.jobId}/radiators/0/readings/after`, {
      topC: 84,
      bottomC: 78,
      flowC: 85,
      returnC: 75,
      roomC: 20,
    });
    const r1 = after.body.sheet.radiators[0].after;
    expect(r1).toMatchObject({ differenceK: 6, deltaTK: 60, coldBottom: false });
    expect(Math.abs(r1.outputWatts - 12_675)).toBeLessThanOrEqual(1);
    // At the rating point 75/65/20 (dT 50) the output is the rated output; the room not taken stays "not taken", the 20 °C rating room is used.
    const rated = await s.engineer.put(`/api/jobs/${s.jobId}/radiators/0/readings/after`, {
      topC: 75,
      bottomC: 65,
      flowC: 75,
      returnC: 65,
    });
    expect(rated.body.sheet.radiators[0].after).toMatchObject({
      deltaTK: 50,
      roomC: null,
      roomUsedC: 20,
      outputWatts: 10_000,
    });
    // No rated output on the survey: no watts, but the difference and the flag.
    const landing = await s.engineer.put(`/api/jobs/${s.jobId}/radiators/1/readings/before`, {
      topC: 60,
      bottomC: 49.5,
    });
    expect(landing.body.sheet.radiators[1].before).toMatchObject({
      differenceK: 10.5,
      coldBottom: true,
      outputWatts: null,
      deltaTFrom: 'surfaces',
    });
  });

  it('flags a cold bottom against the firm\u2019s own threshold', async () => {
    const s = await setUpJobSheet(t, 'threshold');
    await t.deps.db('firms').where({ id: s.firm.firmId }).update({ cold_bottom_threshold_k: 20 });
    const res = await s.engineer.put(`/api/jobs/${s.jobId}/radiators/0/readings/before`, { topC: 60, bottomC: 45 });
    expect(res.body.sheet.coldBottomThresholdK).toBe(20);
    expect(res.body.sheet.radiators[0].before.coldBottom).toBe(false);
  });

  it('refuses a radiator not on the survey (404) and a reading out of range (422), storing nothing', async () => {
    const s = await setUpJobSheet(t, 'readings-bad');
    const missing = await s.engineer.put(`/api/jobs/${s.jobId}/radiators/2/readings/before`, { topC: 60, bottomC: 45 });
    expect(missing.status).toBe(404);
    expect(missing.body.message).toBe('That radiator is not on this job\u2019s survey.');
    const hot = await s.engineer.put(`/api/jobs/${s.jobId}/radiators/0/readings/before`, { topC: 160, bottomC: 45 });
    expect(hot.status).toBe(422);
    expect(hot.body.message).toContain('Top temperature');
    expect(
      (await s.engineer.put(`/api/jobs/${s.jobId}/radiators/0/readings/during`, { topC: 60, bottomC: 45 })).status,
    ).toBe(422);
    expect(await t.deps.db('job_radiator_readings').where({ firm_id: s.firm.firmId })).toHaveLength(0);
  });
});

describe('flushed radiator by radiator', () => {
  it('a tick records when each radiator was flushed until clear; a second tick keeps the first time; clearing removes it', async () => {
    const s = await setUpJobSheet(t, 'flushed');
    const first = await s.engineer.put(`/api/jobs/${s.jobId}/radiators/1/flushed`, { done: true });
    expect(first.status).toBe(200);
    const at = first.body.sheet.radiators[1].flushedAt as string;
    expect(Math.abs(Date.parse(at) - t.clock.now().getTime())).toBeLessThan(5_000);
    expect(first.body.sheet.radiators[0].flushedAt).toBeNull();
    t.clock.advance(minutes(3));
    expect(
      (await s.engineer.put(`/api/jobs/${s.jobId}/radiators/1/flushed`, { done: true })).body.sheet.radiators[1]
        .flushedAt,
    ).toBe(at);
    expect(
      (await s.engineer.put(`/api/jobs/${s.jobId}/radiators/1/flushed`, { done: false })).body.sheet.radiators[1]
        .flushedAt,
    ).toBeNull();
    const off = await s.engineer.put(`/api/jobs/${s.jobId}/radiators/9/flushed`, { done: true });
    expect(off.status).toBe(404);
    expect(off.body.message).toBe('That radiator is not on this job\u2019s survey.');
    expect((await s.engineer.put(`/api/jobs/${s.jobId}/radiators/0/flushed`, { done: 'yes' })).status).toBe(422);
    expect(
      await t.deps
        .db('job_radiator_flushes')
        .where({ firm_id: s.firm.firmId, job_id: s.jobId })
        .count({ n: '*' })
        .first(),
    ).toEqual({ n: 0 });
  });
});

describe('agitation and the hand-arm vibration day', () => {
  it('HSE points: 10 m/s\u00b2 for 30 min is 100, 5 m/s\u00b2 for 3 h is 150; the day sums both jobs of the engineer', async () => {
    const s = await setUpJobSheet(t, 'hav');
    const first = await s.engineer.put(`/api/jobs/${s.jobId}/radiators/0/agitation`, {
      minutes: 30,
      kitItemId: s.toolId,
    });
    expect(first.status).toBe(200);
    // points = 2 x a^2 x hours (HSE points system, Control of Vibration at Work Regulations 2005).
    expect(first.body.sheet.radiators[0].agitation).toMatchObject({
      minutes: 30,
      kitItemId: s.toolId,
      magnitudeMs2: 10,
      points: 100,
    });
    expect(first.body.sheet.hav).toMatchObject({ points: 100, level: 'above_action' });

    // A second job of the same engineer, the same day, with a gentler tool.
    const [softId] = (await t.deps.db('kit_items').insert({
      firm_id: s.firm.firmId,
      kind_id: s.firm.kindId,
      asset_tag: `SOFT${s.firm.firmId}`,
      location_id: s.firm.van.id,
      in_service_since: '2026-11-01',
      vibration_ms2: 5,
    })) as number[];
    const second = await s.engineer.post('/api/jobs', {
      siteId: s.firm.siteId,
      scheduledOn: '2026-12-14',
      productIds: [],
      survey,
    });
    const secondId = second.body.job.id as number;
    const other = await s.engineer.put(`/api/jobs/${secondId}/radiators/1/agitation`, {
      minutes: 180,
      kitItemId: softId,
    });
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
    const s = await setUpJobSheet(t, 'hav-bad');
    await t.deps.db('kit_items').where({ id: s.toolId }).update({ location_id: s.firm.depotId });
    const away = await s.engineer.put(`/api/jobs/${s.jobId}/radiators/0/agitation`, {
      minutes: 10,
      kitItemId: s.toolId,
    });
    expect(away.status).toBe(422);
    expect(away.body.message).toContain('not on this job\u2019s van');
    expect((await s.engineer.put(`/api/jobs/${s.jobId}/radiators/5/agitation`, { minutes: 10 })).status).toBe(404);
    expect((await s.engineer.put(`/api/jobs/${s.jobId}/radiators/0/agitation`, { minutes: 300 })).status).toBe(422);
    expect(await t.deps.db('job_agitations').where({ firm_id: s.firm.firmId })).toHaveLength(0);
    // Time without a known tool counts no points (the magnitude is unknown), but is kept.
    const bare = await s.engineer.put(`/api/jobs/${s.jobId}/radiators/0/agitation`, { minutes: 10 });
    expect(bare.body.sheet.radiators[0].agitation).toMatchObject({
      minutes: 10,
      kitItemId: null,
      magnitudeMs2: null,
      points: 0,
    });
  });
});
