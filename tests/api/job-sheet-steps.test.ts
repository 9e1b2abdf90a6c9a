import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { visitSteps } from '@heatfleet/domain';
import { createTestApp, signIn, type TestApp } from './support/test-app.ts';
import { seedFirm } from './support/seed-firm.ts';
import { minutes, setUpJobSheet } from './support/job-sheet-setup.ts';

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

describe('the job sheet in GET /api/jobs/:id', () => {
  it('keeps the plan and adds the sheet: the visit\u2019s steps in order (a sealed gas full clean), the radiators of the survey, the firm threshold', async () => {
    const s = await setUpJobSheet(t, 'sheet-read');
    const res = await s.engineer.get(`/api/jobs/${s.jobId}`).expect(200);
    expect(Object.keys(res.body)).toEqual(
      expect.arrayContaining(['job', 'survey', 'volume', 'doses', 'today', 'chemicalsUsed', 'sheet']),
    );
    const sheet = res.body.sheet;
    expect(sheet.editable).toBe(true);
    expect(sheet.steps.map((x: { step: string }) => x.step)).toEqual(
      visitSteps({ systemType: 'sealed', fuel: 'gas', visitKind: 'full_clean' }).map((x) => x.step),
    );
    expect(sheet.steps.every((x: { doneAt: null }) => x.doneAt === null)).toBe(true);
    // DEFAULT_COLD_BOTTOM_THRESHOLD_K, common practice (no source).
    expect(sheet.coldBottomThresholdK).toBe(10);
    expect(sheet.circulation).toEqual({ minimumMinutes: 60, startedAt: null, elapsedMinutes: null, met: false });
    expect(sheet.radiators).toEqual([
      expect.objectContaining({
        index: 0,
        room: 'Lounge',
        panel: 'double',
        ratedWatts: 10_000,
        before: null,
        after: null,
        agitation: null,
      }),
      expect.objectContaining({ index: 1, room: 'Landing', ratedWatts: null }),
    ]);
    expect(sheet.kitOnVan).toEqual([expect.objectContaining({ id: s.toolId, vibrationMs2: 10 })]);
    expect(sheet).toMatchObject({ kitUsed: [], photos: [], notes: '', hav: { points: 0, level: 'low' } });
    expect(sheet.hav.engineerName).toContain('engineer');
  });

  it('is not editable for another engineer, who may read it', async () => {
    const s = await setUpJobSheet(t, 'sheet-other');
    const other = await signIn(t.app, s.firm.target.email);
    const res = await other.get(`/api/jobs/${s.jobId}`).expect(200);
    expect(res.body.sheet.editable).toBe(false);
  });
});

describe('steps', () => {
  it('a tick records the time and who; a second tick keeps the first time; clearing removes it', async () => {
    const s = await setUpJobSheet(t, 'steps');
    const first = await s.engineer.put(`/api/jobs/${s.jobId}/steps/depressurise`, { done: true });
    expect(first.status).toBe(200);
    const step = first.body.sheet.steps[0];
    expect(step).toMatchObject({
      step: 'depressurise',
      label: expect.any(String),
      doneByName: expect.stringContaining('engineer'),
    });
    t.clock.advance(minutes(2));
    const again = await s.engineer.put(`/api/jobs/${s.jobId}/steps/depressurise`, { done: true });
    expect(again.body.sheet.steps[0].doneAt).toBe(step.doneAt);
    const cleared = await s.engineer.put(`/api/jobs/${s.jobId}/steps/depressurise`, { done: false });
    expect(cleared.body.sheet.steps[0]).toMatchObject({ doneAt: null, doneByName: null });
    expect((await s.engineer.put(`/api/jobs/${s.jobId}/steps/sing_a_song`, { done: true })).status).toBe(422);
  });

  it('times the hot circulation from the cleaner dose against the cleaner\u2019s minimum', async () => {
    const s = await setUpJobSheet(t, 'circulation');
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

describe('the two settings the sheet reads', () => {
  it('a kit item\u2019s vibration magnitude and a cleaner\u2019s minimum circulation time are edited by the office and shown back', async () => {
    const firm = await seedFirm(t.deps.db, 'sheet-settings');
    const stores = await signIn(t.app, firm.people.stores.email);
    const item = await stores.patch(`/api/kit-items/${firm.looseItemId}`, { vibrationMs2: 8.5 });
    expect(item.status).toBe(200);
    expect(item.body.item.vibrationMs2).toBe(8.5);
    expect((await stores.get(`/api/kit-items/${firm.looseItemId}`)).body.item.vibrationMs2).toBe(8.5);
    expect((await stores.patch(`/api/kit-items/${firm.looseItemId}`, { vibrationMs2: -1 })).status).toBe(422);
    expect(
      (await stores.patch(`/api/kit-items/${firm.looseItemId}`, { vibrationMs2: null })).body.item.vibrationMs2,
    ).toBeNull();

    const product = await stores.put(`/api/products/${firm.product.id}`, {
      name: firm.product.name,
      kind: 'cleaner',
      packSize: 1,
      packUnit: 'l',
      minCirculationMinutes: 60,
    });
    expect(product.status).toBe(200);
    expect(product.body.product.minCirculationMinutes).toBe(60);
    expect((await stores.get(`/api/products/${firm.product.id}`)).body.product.minCirculationMinutes).toBe(60);
    expect(
      (
        await stores.put(`/api/products/${firm.product.id}`, {
          name: firm.product.name,
          kind: 'cleaner',
          packSize: 1,
          packUnit: 'l',
          minCirculationMinutes: 0,
        })
      ).status,
    ).toBe(422);
    const engineer = await signIn(t.app, firm.people.engineer.email);
    expect((await engineer.patch(`/api/kit-items/${firm.looseItemId}`, { vibrationMs2: 3 })).status).toBe(403);
  });
});
