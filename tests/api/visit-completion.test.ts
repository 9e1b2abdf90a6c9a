import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, signIn, type TestApp } from './support/test-app.ts';
import { seedFirm } from './support/seed-firm.ts';
import { setUpJobSheet, minutes } from './support/job-sheet-setup.ts';

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

// The guarded completion: DEVELOPERS.md, Product rules.
describe('the guarded completion', () => {
  it('answers 422 naming each thing not done when its reason is missing, and changes nothing', async () => {
    const s = await setUpJobSheet(t, 'guard-refused');
    const e = s.engineer;
    // The cleaner's minimum is 60 minutes; it ran 20.
    await e.put(`/api/jobs/${s.jobId}/steps/dose_cleaner`, { done: true });
    t.clock.advance(minutes(20));
    await e.put(`/api/jobs/${s.jobId}/steps/circulate_hot`, { done: true });
    await e.put(`/api/jobs/${s.jobId}/radiators/0/readings/after`, { topC: 70, bottomC: 65 });
    await e.put(`/api/jobs/${s.jobId}/radiators/0/flushed`, { done: true });
    const sheet = (await e.get(`/api/jobs/${s.jobId}`)).body.sheet;
    expect(sheet.completionIssues.map((i: { code: string }) => i.code)).toEqual([
      'circulation_short',
      'no_water_test',
      'after_readings_missing',
      'flush_ticks_missing',
    ]);

    const refused = await e.post(`/api/jobs/${s.jobId}/complete`, {
      unsavedInput: true,
      confirmations: [{ code: 'no_water_test', reason: 'Test kit left at the depot' }],
    });
    expect(refused.status).toBe(422);
    expect(refused.body.message).toMatch(/^Give a reason to complete without: /);
    expect(refused.body.details).toEqual([
      {
        path: 'confirmations.circulation_short',
        message: 'Hot circulation ran 20 of the cleaner\u2019s minimum 60 minutes.',
      },
      { path: 'confirmations.after_readings_missing', message: '1 of 2 radiators have no after reading: Landing.' },
      { path: 'confirmations.flush_ticks_missing', message: '1 of 2 radiators are not ticked as flushed: Landing.' },
      { path: 'confirmations.unsaved_input', message: 'The page held input that was not saved.' },
    ]);
    const job = await t.deps.db('jobs').where({ id: s.jobId }).first('status', 'report_number');
    expect(job).toEqual({ status: 'planned', report_number: null });
    expect(await t.deps.db('stock_movements').where({ firm_id: s.firm.firmId, job_id: s.jobId })).toHaveLength(0);
    expect(await t.deps.db('job_completion_reasons').where({ job_id: s.jobId })).toHaveLength(0);
  });

  it('with a reason for each it completes; the reasons are stored with what was found and come back on the job', async () => {
    const s = await setUpJobSheet(t, 'guard-reasons');
    const e = s.engineer;
    const confirmations = [
      { code: 'circulation_short', reason: 'Customer needed the heating back on' },
      { code: 'no_water_test', reason: 'Test kit left at the depot' },
      { code: 'after_readings_missing', reason: 'Thermometer battery flat' },
      { code: 'flush_ticks_missing', reason: 'Landing valve seized; left for a return visit' },
    ];
    const done = await e.post(`/api/jobs/${s.jobId}/complete`, { confirmations });
    expect(done.status).toBe(200);
    expect(done.body.job.status).toBe('completed');
    expect(done.body.job.completionReasons).toEqual([
      {
        code: 'circulation_short',
        label: 'Hot circulation shorter than the cleaner\u2019s minimum',
        found: 'Hot circulation was not started (the cleaner\u2019s minimum is 60 minutes).',
        reason: 'Customer needed the heating back on',
      },
      {
        code: 'no_water_test',
        label: 'Water test not done',
        found: 'Not recorded: the flush test (mains and system TDS) and the inhibitor reading.',
        reason: 'Test kit left at the depot',
      },
      {
        code: 'after_readings_missing',
        label: 'Radiators without after readings',
        found: '2 of 2 radiators have no after reading: Lounge, Landing.',
        reason: 'Thermometer battery flat',
      },
      {
        code: 'flush_ticks_missing',
        label: 'Radiators not ticked as flushed',
        found: '2 of 2 radiators are not ticked as flushed: Lounge, Landing.',
        reason: 'Landing valve seized; left for a return visit',
      },
    ]);
    const stored = await t.deps
      .db('job_completion_reasons')
      .where({ firm_id: s.firm.firmId, job_id: s.jobId })
      .orderBy('id')
      .select('code', 'reason');
    expect(stored.map((r) => r.code)).toEqual(confirmations.map((c) => c.code));
    // The report number is the firm's next: the seeded job is not completed, so this is the first.
    expect(done.body.job.reportNumber).toBe('HF-000001');
  });

  it('a whole visit asks for nothing; report numbers run on per firm', async () => {
    const s = await setUpJobSheet(t, 'guard-whole');
    const e = s.engineer;
    await e.put(`/api/jobs/${s.jobId}/steps/dose_cleaner`, { done: true });
    t.clock.advance(minutes(61));
    await e.put(`/api/jobs/${s.jobId}/steps/circulate_hot`, { done: true });
    for (const i of [0, 1]) {
      await e.put(`/api/jobs/${s.jobId}/radiators/${i}/readings/after`, { topC: 70, bottomC: 66 });
      await e.put(`/api/jobs/${s.jobId}/radiators/${i}/flushed`, { done: true });
    }
    await e.put(`/api/jobs/${s.jobId}/water-tests`, {
      mainsTdsPpm: 180,
      systemTdsPpm: 190,
      waterClear: true,
      inhibitorReading: 1.2,
      inhibitorProductId: s.inhibitorId,
    });
    expect((await e.get(`/api/jobs/${s.jobId}`)).body.sheet.completionIssues).toEqual([]);
    const done = await e.post(`/api/jobs/${s.jobId}/complete`, {});
    expect(done.status).toBe(200);
    expect(done.body.job.completionReasons).toEqual([]);
    expect(done.body.job.reportNumber).toBe('HF-000001');
    // The firm's seeded job next: nothing recorded, so it needs its reasons; its number follows on.
    const next = await e.post(`/api/jobs/${s.firm.jobId}/complete`, {
      confirmations: [
        { code: 'circulation_short', reason: 'Seeded job' },
        { code: 'no_water_test', reason: 'Seeded job' },
        { code: 'after_readings_missing', reason: 'Seeded job' },
        { code: 'flush_ticks_missing', reason: 'Seeded job' },
      ],
    });
    expect(next.status).toBe(200);
    expect(next.body.job.reportNumber).toBe('HF-000002');
  });

  it('an inhibitor-only visit asks only for the inhibitor reading', async () => {
    const firm = await seedFirm(t.deps.db, 'guard-inhibitor');
    const e = await signIn(t.app, firm.people.engineer.email);
    const booked = await e.post('/api/jobs', {
      siteId: firm.siteId,
      scheduledOn: '2026-12-15',
      productIds: [firm.product.id],
      visitKind: 'inhibitor_only',
      survey: {
        systemType: 'sealed',
        boilerKind: 'combi',
        fuel: 'gas',
        radiators: [{ room: 'Hall', panel: 'single' }],
        pipeRuns: [],
      },
    });
    const id = booked.body.job.id as number;
    const refused = await e.post(`/api/jobs/${id}/complete`, {});
    expect(refused.status).toBe(422);
    expect(refused.body.details).toEqual([
      { path: 'confirmations.no_water_test', message: 'Not recorded: the inhibitor reading.' },
    ]);
    await e.put(`/api/jobs/${id}/water-tests`, { inhibitorReading: 110 });
    expect((await e.post(`/api/jobs/${id}/complete`, {})).status).toBe(200);
  });
});

describe('kit marked as used on a job counts as a use for its inspection rule', () => {
  it('each item listed on the job is one use at completion, beside the check-ins; an inspection starts the count again', async () => {
    // DEVELOPERS.md, Product rules: inspection due after the kind's number of uses.
    const s = await setUpJobSheet(t, 'kit-uses');
    const item = await t.deps.db('kit_items').where({ id: s.toolId }).first('kind_id');
    await t.deps.db('item_kinds').where({ id: item.kind_id }).update({ interval_days: null, interval_uses: 2 });
    const office = await signIn(t.app, s.firm.people.stores.email);
    const uses = async () =>
      (await office.get(`/api/kit-items/${s.toolId}`).expect(200)).body.item.inspection as {
        usesSinceInspection: number;
        usesLeft: number;
        state: string;
      };
    expect(await uses()).toMatchObject({ usesSinceInspection: 0, usesLeft: 2 });
    await s.engineer.put(`/api/jobs/${s.jobId}/kit`, { kitItemIds: [s.toolId] });
    // Marking is not using: nothing counts until the job is completed.
    expect((await uses()).usesSinceInspection).toBe(0);
    const reasons = {
      confirmations: ['circulation_short', 'no_water_test', 'after_readings_missing', 'flush_ticks_missing'].map(
        (code) => ({ code, reason: 'Not the point of this test' }),
      ),
    };
    expect((await s.engineer.post(`/api/jobs/${s.jobId}/complete`, reasons)).status).toBe(200);
    expect(await uses()).toMatchObject({ usesSinceInspection: 1, usesLeft: 1, state: 'due_soon' });
    // A second job using it brings the rule's two uses: overdue.
    const second = await s.engineer.post('/api/jobs', {
      siteId: s.firm.siteId,
      scheduledOn: '2026-12-16',
      survey: {
        systemType: 'sealed',
        boilerKind: 'combi',
        fuel: 'gas',
        radiators: [{ room: 'Hall', panel: 'single' }],
        pipeRuns: [],
      },
    });
    await s.engineer.put(`/api/jobs/${second.body.job.id}/kit`, { kitItemIds: [s.toolId] });
    expect((await s.engineer.post(`/api/jobs/${second.body.job.id}/complete`, reasons)).status).toBe(200);
    expect(await uses()).toMatchObject({ usesSinceInspection: 2, usesLeft: 0, state: 'overdue' });
    expect(await t.deps.db('kit_item_uses').where({ firm_id: s.firm.firmId, item_id: s.toolId })).toHaveLength(2);
    // The overview counts them the same way.
    const owner = await signIn(t.app, s.firm.people.owner.email);
    const overview = (await owner.get('/api/overview').expect(200)).body;
    expect(overview.overview.kit.overdue.find((i: { id: number }) => i.id === s.toolId)).toMatchObject({
      state: 'overdue',
      usesLeft: 0,
      reason: 'uses',
    });
    t.clock.advance(minutes(1));
    const inspected = await office.post(`/api/kit-items/${s.toolId}/inspections`, {
      result: 'passed',
      photoId: s.firm.photoId,
    });
    expect(inspected.status).toBe(201);
    expect(await uses()).toMatchObject({ usesSinceInspection: 0, usesLeft: 2 });
  });
});
