import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { completionCodes } from '@heatfleet/domain';
import { createTestApp, signIn, type TestApp } from './support/test-app.ts';
import { seedFirm } from './support/seed-firm.ts';
import { tinyPng } from './support/route-probes.ts';
import { COMPLETED, setUpJobSheet, sheetRowCounts, writes } from './support/job-sheet-setup.ts';

/** A reason for everything the completion guard could ask about: these tests are about what completion does, not the guard (visit-completion.test.ts). */
const allReasons = { confirmations: completionCodes.map((code) => ({ code, reason: 'Not the point of this test' })) };

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

describe('who may write, and when', () => {
  it('another engineer of the firm is refused (403) on every write; another firm gets 404', async () => {
    const s = await setUpJobSheet(t, 'writes-who');
    const other = await signIn(t.app, s.firm.target.email);
    for (const [label, call] of writes(other, s)) expect((await call()).status, label).toBe(403);
    const stranger = await seedFirm(t.deps.db, 'writes-stranger');
    const owner = await signIn(t.app, stranger.people.owner.email);
    for (const [label, call] of writes(owner, s)) expect((await call()).status, label).toBe(404);
    expect((await sheetRowCounts(t, s)).counts).toEqual([0, 0, 0, 0, 0, 0, 0]);
    // The office may write an engineer's sheet.
    const stores = await signIn(t.app, s.firm.people.stores.email);
    expect((await stores.put(`/api/jobs/${s.jobId}/notes`, { notes: 'office note' })).status).toBe(200);
  });

  it('once completed, every write answers 409 in plain words and nothing changes; the sheet is read-only', async () => {
    const s = await setUpJobSheet(t, 'writes-done');
    expect((await s.engineer.put(`/api/jobs/${s.jobId}/notes`, { notes: 'before completion' })).status).toBe(200);
    await s.engineer.post(`/api/jobs/${s.jobId}/complete`, allReasons).then((r) => expect(r.status).toBe(200));
    const before = await sheetRowCounts(t, s);
    for (const [label, call] of writes(s.engineer, s)) {
      const res = await call();
      expect(res.status, label).toBe(409);
      expect(res.body.message, label).toBe(COMPLETED);
    }
    expect(await sheetRowCounts(t, s)).toEqual(before);
    expect((await s.engineer.get(`/api/jobs/${s.jobId}`)).body.sheet.editable).toBe(false);
  });

  it('a write waiting on a completion that holds the job\u2019s lock is refused once it commits', async () => {
    const s = await setUpJobSheet(t, 'writes-race');
    const trx = await t.deps.db.transaction();
    try {
      await trx('jobs').where({ firm_id: s.firm.firmId, id: s.jobId }).forUpdate().first('id');
      const pending = s.engineer.put(`/api/jobs/${s.jobId}/notes`, { notes: 'racing note' });
      await new Promise((r) => setTimeout(r, 400));
      await trx('jobs')
        .where({ firm_id: s.firm.firmId, id: s.jobId })
        .update({ status: 'completed', completed_at: new Date() });
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
    const s = await setUpJobSheet(t, 'photo-race');
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
      const pending = s.engineer.upload(
        `/api/jobs/${s.jobId}/photos`,
        { tag: 'system' },
        { field: 'photo', content: tinyPng, filename: 'p.png', contentType: 'image/png' },
      );
      await new Promise((r) => setTimeout(r, 400));
      await trx('jobs')
        .where({ firm_id: s.firm.firmId, id: s.jobId })
        .update({ status: 'completed', completed_at: new Date() });
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
    const s = await setUpJobSheet(t, 'writes-together');
    const sent = writes(s.engineer, s);
    const [completion, ...answers] = await Promise.all([
      s.engineer.post(`/api/jobs/${s.jobId}/complete`, allReasons),
      ...sent.map(([, call]) => call()),
    ]);
    expect(completion.status).toBe(200);
    const job = await t.deps.db('jobs').where({ id: s.jobId }).first('completed_at', 'notes');
    const steps = await t.deps.db('job_steps').where({ firm_id: s.firm.firmId, job_id: s.jobId });
    for (const [i, res] of answers.entries()) expect([200, 201, 409], sent[i]![0]).toContain(res.status);
    // A write that answered 409 left nothing; one that landed did so before the completion.
    const notesAnswer = answers[5]!;
    expect(job.notes).toBe(notesAnswer.status === 200 ? 'late note' : null);
    for (const st of steps)
      expect(new Date(st.done_at).getTime()).toBeLessThanOrEqual(new Date(job.completed_at).getTime());
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
      const res = await engineer.post(`/api/jobs/${firm.jobId}/complete`, allReasons);
      expect(res.status).toBe(200);
      expect(res.body.job.nextCheckOn).toBe('2029-01-15');
      expect((await app.deps.db('sites').where({ id: firm.siteId }).first('next_check_on')).next_check_on).toBe(
        '2029-01-15',
      );
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
    const s = await setUpJobSheet(t, 'sheet-report');
    const e = s.engineer;
    const ok = (res: { status: number }) => expect(res.status).toBeLessThan(300);
    const visitSteps = (await e.get(`/api/jobs/${s.jobId}`)).body.sheet.steps as { step: string }[];
    for (const { step } of visitSteps) ok(await e.put(`/api/jobs/${s.jobId}/steps/${step}`, { done: true }));
    // Lounge: a cold bottom before (diff 18 K > 10), cleared after (diff 6); dT 30 then dT 60 (EN 442 factors 0.5148, 1.2675).
    ok(
      await e.put(`/api/jobs/${s.jobId}/radiators/0/readings/before`, {
        topC: 58,
        bottomC: 40,
        flowC: 55,
        returnC: 45,
        roomC: 20,
      }),
    );
    ok(
      await e.put(`/api/jobs/${s.jobId}/radiators/0/readings/after`, {
        topC: 84,
        bottomC: 78,
        flowC: 85,
        returnC: 75,
        roomC: 20,
      }),
    );
    ok(await e.put(`/api/jobs/${s.jobId}/radiators/1/readings/before`, { topC: 61.5, bottomC: 47.5 }));
    // 10 m/s^2 for 30 minutes: 100 HSE points.
    ok(await e.put(`/api/jobs/${s.jobId}/radiators/0/agitation`, { minutes: 30, kitItemId: s.toolId }));
    ok(await e.put(`/api/jobs/${s.jobId}/radiators/0/flushed`, { done: true }));
    ok(
      await e.put(`/api/jobs/${s.jobId}/water-tests`, {
        mainsTdsPpm: 200,
        systemTdsPpm: 215,
        waterClear: true,
        inhibitorReading: 1.2,
        inhibitorProductId: s.inhibitorId,
        ph: 7.8,
      }),
    );
    ok(await e.put(`/api/jobs/${s.jobId}/kit`, { kitItemIds: [s.toolId] }));
    ok(
      await e.put(`/api/jobs/${s.jobId}/notes`, {
        notes: 'Magnet heavy on the first pass; customer shown the sludge.',
      }),
    );
    ok(
      await e.upload(
        `/api/jobs/${s.jobId}/photos`,
        { tag: 'magnet_before', caption: 'First pass' },
        { field: 'photo', content: tinyPng, filename: 'm.png', contentType: 'image/png' },
      ),
    );
    ok(
      await e.upload(
        `/api/jobs/${s.jobId}/photos`,
        { tag: 'test_result', caption: 'Refractometer' },
        { field: 'photo', content: tinyWebp, filename: 'r.webp', contentType: 'image/webp' },
      ),
    );
    const done = await e.post(`/api/jobs/${s.jobId}/complete`, allReasons);
    expect(done.status).toBe(200);
    const nextCheckOn = done.body.job.nextCheckOn as string;

    const res = await e
      .get(`/api/jobs/${s.jobId}/report.pdf`)
      .buffer(true)
      .parse((r, cb) => {
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
