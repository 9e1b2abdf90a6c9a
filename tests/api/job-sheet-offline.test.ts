import { randomUUID } from 'node:crypto';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type Client, type TestApp } from './support/test-app.ts';
import { minutes, setUpJobSheet, type JobSheetSetup } from './support/job-sheet-setup.ts';
import { tinyPng } from './support/route-probes.ts';

// The job sheet's writes as the phone's queue sends them (apps/web/src/lib/offline): each with an Idempotency-Key
// made at the tap and X-Tapped-At, the tap time. At most once per key; the tap time kept beside the arrival and
// shown as the engineer's time; a later tap wins and the earlier is kept (job_sheet_events); the notes and the
// survey refuse a stale version with 409 (DEVELOPERS.md, Working offline).

let t: TestApp;
let advanced = 0;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());
afterEach(() => {
  t.clock.advance(-advanced);
  advanced = 0;
});

/** Books the job, then moves the clock on an hour, so taps within that hour are after the booking. */
async function bookedAnHourAgo(label: string): Promise<JobSheetSetup> {
  const s = await setUpJobSheet(t, label);
  t.clock.advance(minutes(60));
  advanced += minutes(60);
  return s;
}

const ago = (n: number) => new Date(t.clock.now().getTime() - minutes(n)).toISOString();

async function queued(
  client: Client,
  method: 'put' | 'post' | 'patch',
  url: string,
  body: unknown,
  opts: { key?: string; tappedAt?: string } = {},
) {
  if (!client.csrfToken) await client.refreshCsrf();
  let req = client.agent[method](url)
    .set('X-CSRF-Token', client.csrfToken)
    .set('Idempotency-Key', opts.key ?? randomUUID());
  if (opts.tappedAt) req = req.set('X-Tapped-At', opts.tappedAt);
  return req.send(body as object);
}

describe('job-sheet writes sent again with their Idempotency-Key', () => {
  it('apply once: readings, agitation, flush and step ticks, water tests, notes, signature and photo', async () => {
    const s = await bookedAnHourAgo('once');
    const db = t.deps.db;
    const base = `/api/jobs/${s.jobId}`;
    const writes: [method: 'put' | 'post', url: string, body: unknown][] = [
      ['put', `${base}/radiators/0/readings/before`, { topC: 61.2, bottomC: 44 }],
      ['put', `${base}/radiators/0/agitation`, { minutes: 3, kitItemId: s.toolId }],
      ['put', `${base}/radiators/0/flushed`, { done: true }],
      ['put', `${base}/steps/dose_cleaner`, { done: true }],
      ['put', `${base}/water-tests`, { mainsTdsPpm: 180, systemTdsPpm: 190, ph: 7.5 }],
      ['put', `${base}/notes`, { notes: 'Airing cupboard valve stiff.', notesVersion: 0 }],
      [
        'post',
        `${base}/signatures`,
        {
          kind: 'acknowledgement',
          name: 'A Householder',
          imagePngDataUrl: `data:image/png;base64,${tinyPng.toString('base64')}`,
        },
      ],
    ];
    for (const [method, url, body] of writes) {
      const key = randomUUID();
      const tappedAt = ago(30);
      const first = await queued(s.engineer, method, url, body, { key, tappedAt });
      expect(first.status, url).toBeLessThan(300);
      // The phone never heard the answer and sends the same write again, twice.
      for (let i = 0; i < 2; i++) {
        const again = await queued(s.engineer, method, url, body, { key, tappedAt });
        expect(again.status, url).toBe(first.status);
      }
    }
    const jobOf = { firm_id: s.firm.firmId, job_id: s.jobId };
    expect(await db('job_sheet_events').where(jobOf)).toHaveLength(5);
    expect(await db('job_radiator_readings').where(jobOf)).toHaveLength(1);
    expect(await db('job_signatures').where(jobOf)).toHaveLength(1);
    const job = await db('jobs').where({ id: s.jobId }).first('notes', 'notes_version');
    // Saved once: a second application would have raised the version to 2 (or been refused as stale).
    expect(job).toMatchObject({ notes: 'Airing cupboard valve stiff.', notes_version: 1 });

    const key = randomUUID();
    const photo = async () => {
      let req = s.engineer.agent
        .post(`${base}/photos`)
        .set('X-CSRF-Token', s.engineer.csrfToken)
        .set('Idempotency-Key', key)
        .set('X-Tapped-At', ago(20));
      req = req.field('tag', 'magnet_before');
      return req.attach('photo', tinyPng, { filename: 'magnet.png', contentType: 'image/png' });
    };
    const up1 = await photo();
    const up2 = await photo();
    expect(up1.status).toBe(201);
    expect(up2.status).toBe(201);
    expect(up2.body.photo.id).toBe(up1.body.photo.id);
    expect(await db('photos').where(jobOf)).toHaveLength(1);
  });

  it('refuses the same key with a different body (422) and changes nothing', async () => {
    const s = await bookedAnHourAgo('mismatch');
    const url = `/api/jobs/${s.jobId}/radiators/1/readings/before`;
    const key = randomUUID();
    expect((await queued(s.engineer, 'put', url, { topC: 60, bottomC: 50 }, { key })).status).toBe(200);
    const other = await queued(s.engineer, 'put', url, { topC: 70, bottomC: 50 }, { key });
    expect(other.status).toBe(422);
    expect(other.body.error).toBe('IdempotencyKeyMismatch');
    const sheet = (await s.engineer.get(`/api/jobs/${s.jobId}`).expect(200)).body.sheet;
    expect(sheet.radiators[1].before.topC).toBe(60);
  });

  it('POST /api/photos with the same key stores one photo', async () => {
    const s = await bookedAnHourAgo('photos-once');
    const key = randomUUID();
    const loose = () => t.deps.db('photos').where({ firm_id: s.firm.firmId }).whereNull('job_id');
    const before = (await loose()).length;
    await s.engineer.refreshCsrf();
    const send = () =>
      s.engineer.agent
        .post('/api/photos')
        .set('X-CSRF-Token', s.engineer.csrfToken)
        .set('Idempotency-Key', key)
        .attach('photo', tinyPng, { filename: 'rig.png', contentType: 'image/png' });
    const a = await send();
    const b = await send();
    expect(a.status).toBe(201);
    expect(b.body.photo.id).toBe(a.body.photo.id);
    expect(await loose()).toHaveLength(before + 1);
  });
});

describe('the tap time on the sheet', () => {
  it('is kept beside the arrival and is the time the sheet and the report show', async () => {
    const s = await bookedAnHourAgo('tap-times');
    const db = t.deps.db;
    const base = `/api/jobs/${s.jobId}`;
    const flushTap = ago(40);
    const stepTap = ago(45);
    const readingTap = ago(50);
    await queued(
      s.engineer,
      'put',
      `${base}/radiators/0/readings/before`,
      { topC: 60, bottomC: 40 },
      { tappedAt: readingTap },
    );
    await queued(s.engineer, 'put', `${base}/radiators/1/flushed`, { done: true }, { tappedAt: flushTap });
    await queued(s.engineer, 'put', `${base}/steps/dose_cleaner`, { done: true }, { tappedAt: stepTap });
    const reading = await db('job_radiator_readings').where({ job_id: s.jobId }).first('tapped_at', 'recorded_at');
    expect((reading.tapped_at as Date).toISOString()).toBe(readingTap);
    // Arrived now, about 50 minutes after the tap.
    expect((reading.recorded_at as Date).getTime()).toBeGreaterThan(Date.parse(readingTap) + minutes(49));
    const sheet = (await s.engineer.get(base).expect(200)).body.sheet;
    expect(sheet.radiators[1].flushedAt).toBe(flushTap);
    expect(sheet.steps.find((x: { step: string }) => x.step === 'dose_cleaner').doneAt).toBe(stepTap);
  });

  it('refuses a tap before the job was booked or in the future (422), writing nothing', async () => {
    const s = await bookedAnHourAgo('tap-sane');
    const url = `/api/jobs/${s.jobId}/radiators/0/flushed`;
    const before = await queued(s.engineer, 'put', url, { done: true }, { tappedAt: ago(90) });
    expect(before.status).toBe(422);
    expect(before.body.message).toMatch(/before the job was booked/);
    expect(before.body.details).toEqual([expect.objectContaining({ path: 'X-Tapped-At' })]);
    const future = await queued(s.engineer, 'put', url, { done: true }, { tappedAt: ago(-5) });
    expect(future.status).toBe(422);
    expect(await t.deps.db('job_radiator_flushes').where({ job_id: s.jobId })).toHaveLength(0);
    expect(await t.deps.db('job_sheet_events').where({ job_id: s.jobId })).toHaveLength(0);
    // Half a minute before the booking is the phone's clock drift (a minute allowed), not a refusal.
    expect((await queued(s.engineer, 'put', url, { done: true }, { tappedAt: ago(60.5) })).status).toBe(200);
  });
});

describe('readings and ticks are events', () => {
  it('a later tap wins even when it arrives first; both are kept', async () => {
    const s = await bookedAnHourAgo('events');
    const url = `/api/jobs/${s.jobId}/radiators/0/readings/after`;
    // Another engineer's reading, tapped 5 minutes ago, arrives first; the phone's, tapped 20 minutes ago, after.
    await queued(s.engineer, 'put', url, { topC: 70, bottomC: 66 }, { tappedAt: ago(5) });
    const late = await queued(s.engineer, 'put', url, { topC: 55, bottomC: 35 }, { tappedAt: ago(20) });
    expect(late.status).toBe(200);
    expect(late.body.sheet.radiators[0].after).toMatchObject({ topC: 70, bottomC: 66 });
    const events = await t.deps
      .db('job_sheet_events')
      .where({ job_id: s.jobId, target: 'reading:0:after' })
      .orderBy('id');
    expect(events.map((e) => Boolean(e.applied))).toEqual([true, false]);
    expect(events.map((e) => (typeof e.value === 'string' ? JSON.parse(e.value) : e.value).top_c)).toEqual([70, 55]);

    // A flush tick cleared later than it was ticked stays cleared when the older tick arrives afterwards.
    const flush = `/api/jobs/${s.jobId}/radiators/0/flushed`;
    await queued(s.engineer, 'put', flush, { done: false }, { tappedAt: ago(2) });
    const oldTick = await queued(s.engineer, 'put', flush, { done: true }, { tappedAt: ago(10) });
    expect(oldTick.body.sheet.radiators[0].flushedAt).toBeNull();
  });
});

describe('versions of what two people could edit', () => {
  it('notes: a save made on an old version answers 409 and keeps the other person\u2019s notes', async () => {
    const s = await bookedAnHourAgo('notes-version');
    const url = `/api/jobs/${s.jobId}/notes`;
    const first = await queued(s.engineer, 'put', url, { notes: 'Mine', notesVersion: 0 });
    expect(first.body.sheet).toMatchObject({ notes: 'Mine', notesVersion: 1 });
    const stale = await queued(s.engineer, 'put', url, { notes: 'Theirs, from version 0', notesVersion: 0 });
    expect(stale.status).toBe(409);
    expect(stale.body.error).toBe('StaleVersion');
    expect(stale.body.message).toMatch(/Someone else saved the notes/);
    const sheet = (await s.engineer.get(`/api/jobs/${s.jobId}`).expect(200)).body.sheet;
    expect(sheet).toMatchObject({ notes: 'Mine', notesVersion: 1 });
    // Settled: sent again on the version now shown.
    const settled = await queued(s.engineer, 'put', url, { notes: 'Mine and theirs', notesVersion: 1 });
    expect(settled.body.sheet).toMatchObject({ notes: 'Mine and theirs', notesVersion: 2 });
  });

  it('survey: an edit made on an old version answers 409 and changes nothing', async () => {
    const s = await bookedAnHourAgo('survey-version');
    const detail = (await s.engineer.get(`/api/jobs/${s.jobId}`).expect(200)).body;
    expect(detail.job.surveyVersion).toBe(0);
    const edited = {
      ...detail.survey,
      radiators: [...detail.survey.radiators, { ...detail.survey.radiators[1], room: 'Hall' }],
    };
    const ok = await queued(s.engineer, 'patch', `/api/jobs/${s.jobId}`, { survey: edited, surveyVersion: 0 });
    expect(ok.status).toBe(200);
    expect(ok.body.job.surveyVersion).toBe(1);
    const stale = await queued(s.engineer, 'patch', `/api/jobs/${s.jobId}`, {
      survey: detail.survey,
      surveyVersion: 0,
    });
    expect(stale.status).toBe(409);
    expect(stale.body.error).toBe('StaleVersion');
    const now = (await s.engineer.get(`/api/jobs/${s.jobId}`).expect(200)).body;
    expect(now.survey.radiators).toHaveLength(3);
  });
});

describe('completion with its tap time', () => {
  it('keeps the tap as the completion time shown, once per key', async () => {
    const s = await bookedAnHourAgo('complete-tap');
    const tappedAt = ago(15);
    // Ask the guard what needs a reason (nothing is recorded on this sheet), then give each one.
    const asked = await queued(s.engineer, 'post', `/api/jobs/${s.jobId}/complete`, {});
    expect(asked.status).toBe(422);
    const codes = (asked.body.details as { path: string }[]).map((d) => d.path.replace('confirmations.', ''));
    const body = { confirmations: codes.map((code) => ({ code, reason: 'Not done in this test' })) };
    const key = randomUUID();
    const res = await queued(s.engineer, 'post', `/api/jobs/${s.jobId}/complete`, body, { key, tappedAt });
    expect(res.status).toBe(200);
    expect(res.body.job.completedAt).toBe(tappedAt);
    const used = async () =>
      (await t.deps.db('stock_movements').where({ firm_id: s.firm.firmId, job_id: s.jobId, kind: 'used' })).length;
    const usedOnce = await used();
    expect(usedOnce).toBeGreaterThan(0);
    const again = await queued(s.engineer, 'post', `/api/jobs/${s.jobId}/complete`, body, { key, tappedAt });
    expect(again.status).toBe(200);
    expect(await used()).toBe(usedOnce);
    const row = await t.deps.db('jobs').where({ id: s.jobId }).first('completed_at', 'completed_tapped_at');
    expect((row.completed_tapped_at as Date).toISOString()).toBe(tappedAt);
    expect((row.completed_at as Date).getTime()).toBeGreaterThan(Date.parse(tappedAt) + minutes(14));
  });
});
