import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Readable } from 'node:stream';
import { createTestApp, signIn, type TestApp } from './support/test-app.ts';
import { seedFirm } from './support/seed-firm.ts';
import { tinyPng } from './support/route-probes.ts';
import { setUpJobSheet } from './support/job-sheet-setup.ts';

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

const dataUrl = (b: Buffer) => `data:image/png;base64,${b.toString('base64')}`;

async function stored(key: string): Promise<Buffer> {
  const parts: Buffer[] = [];
  for await (const p of (await t.deps.objectStore.get(key)) as Readable) parts.push(p as Buffer);
  return Buffer.concat(parts);
}

describe('the customer\u2019s signatures', () => {
  it('are stored as PNGs in the object store with the name and the time, shown on the sheet and served to the firm', async () => {
    const s = await setUpJobSheet(t, 'sign');
    const e = s.engineer;
    const res = await e.post(`/api/jobs/${s.jobId}/signatures`, {
      kind: 'acknowledgement',
      name: 'Pat Customer',
      imagePngDataUrl: dataUrl(tinyPng),
    });
    expect(res.status).toBe(201);
    expect(res.body.signature).toEqual({
      kind: 'acknowledgement',
      name: 'Pat Customer',
      signedAt: expect.any(String),
      url: `/api/jobs/${s.jobId}/signatures/acknowledgement`,
    });
    const row = await t.deps.db('job_signatures').where({ firm_id: s.firm.firmId, job_id: s.jobId }).first();
    expect(row).toMatchObject({ kind: 'acknowledgement', signer_name: 'Pat Customer', byte_size: tinyPng.length });
    expect(row.object_key.startsWith(`firms/${s.firm.firmId}/signatures/`)).toBe(true);
    expect((await stored(row.object_key)).equals(tinyPng)).toBe(true);

    const sheet = (await e.get(`/api/jobs/${s.jobId}`)).body.sheet;
    expect(sheet.signatures).toEqual([res.body.signature]);
    const image = await e
      .get(res.body.signature.url)
      .buffer(true)
      .parse((r, cb) => {
        const parts: Buffer[] = [];
        r.on('data', (c: Buffer) => parts.push(c));
        r.on('end', () => cb(null, Buffer.concat(parts)));
      });
    expect(image.status).toBe(200);
    expect(image.headers['content-type']).toBe('image/png');
    expect((image.body as Buffer).equals(tinyPng)).toBe(true);
    expect((await e.get(`/api/jobs/${s.jobId}/signatures/acceptance`)).status).toBe(404);

    // Signing the same kind again replaces it, and the earlier object is removed.
    const again = await e.post(`/api/jobs/${s.jobId}/signatures`, {
      kind: 'acknowledgement',
      name: 'Pat Customer-Jones',
      imagePngDataUrl: dataUrl(tinyPng),
    });
    expect(again.status).toBe(201);
    const rows = await t.deps.db('job_signatures').where({ firm_id: s.firm.firmId, job_id: s.jobId });
    expect(rows).toHaveLength(1);
    expect(rows[0].signer_name).toBe('Pat Customer-Jones');
    await expect(stored(row.object_key)).rejects.toThrow();
  });

  it('refuses what is not a PNG, and one too large, storing nothing', async () => {
    const s = await setUpJobSheet(t, 'sign-refused');
    const e = s.engineer;
    const put: string[] = [];
    const store = t.deps.objectStore;
    const original = store.put.bind(store);
    store.put = async (key, body, type) => {
      put.push(key);
      return original(key, body, type);
    };
    try {
      const jpegBytes = Buffer.from([0xff, 0xd8, 0xff, 0xe0, ...Buffer.alloc(40)]);
      const lying = await e.post(`/api/jobs/${s.jobId}/signatures`, {
        kind: 'acceptance',
        name: 'Pat',
        imagePngDataUrl: dataUrl(jpegBytes),
      });
      expect(lying.status).toBe(422);
      expect(lying.body.message).toBe('The signature is not a PNG image: draw it again.');
      const jpegUrl = await e.post(`/api/jobs/${s.jobId}/signatures`, {
        kind: 'acceptance',
        name: 'Pat',
        imagePngDataUrl: `data:image/jpeg;base64,${jpegBytes.toString('base64')}`,
      });
      expect(jpegUrl.status).toBe(422);
      // A PNG of 70 kB: the data URL alone passes the 100 kB body limit, the decoded image does not pass 64 kB.
      const big = Buffer.concat([tinyPng.subarray(0, 33), Buffer.alloc(70 * 1024)]);
      const tooBig = await e.post(`/api/jobs/${s.jobId}/signatures`, {
        kind: 'acceptance',
        name: 'Pat',
        imagePngDataUrl: dataUrl(big),
      });
      expect([413, 422]).toContain(tooBig.status);
      expect(put).toEqual([]);
    } finally {
      store.put = original;
    }
    expect(await t.deps.db('job_signatures').where({ job_id: s.jobId })).toHaveLength(0);
  });

  it('are refused on a completed job and for another engineer', async () => {
    const firm = await seedFirm(t.deps.db, 'sign-closed');
    const engineer = await signIn(t.app, firm.people.engineer.email);
    const other = await signIn(t.app, firm.target.email);
    const body = { kind: 'acceptance', name: 'Pat', imagePngDataUrl: dataUrl(tinyPng) };
    expect((await other.post(`/api/jobs/${firm.jobId}/signatures`, body)).status).toBe(403);
    const reasons = ['no_water_test', 'after_readings_missing', 'flush_ticks_missing'].map((code) => ({
      code,
      reason: 'Seeded job',
    }));
    expect((await engineer.post(`/api/jobs/${firm.jobId}/complete`, { confirmations: reasons })).status).toBe(200);
    expect((await engineer.post(`/api/jobs/${firm.jobId}/signatures`, body)).status).toBe(409);
  });
});

describe('the flush order', () => {
  it('is set once by the engineer, kept on the site, and found again by room on the next visit\u2019s survey', async () => {
    // The furthest radiator from the rig first, working back towards it: common practice (no source).
    const firm = await seedFirm(t.deps.db, 'flush-order');
    const engineer = await signIn(t.app, firm.people.engineer.email);
    const rooms = ['Lounge', 'Kitchen', 'Bedroom 1', 'Bedroom 2', 'Bathroom'];
    const survey = {
      systemType: 'open_vented',
      boilerKind: 'regular',
      fuel: 'oil',
      radiators: rooms.map((room) => ({ room, panel: 'single' })),
      pipeRuns: [],
    };
    const first = (await engineer.post('/api/jobs', { siteId: firm.siteId, scheduledOn: '2026-12-15', survey })).body;
    expect(first.sheet.flushOrder).toEqual({ radiatorIndexes: [0, 1, 2, 3, 4], from: 'survey' });
    const set = await engineer.put(`/api/jobs/${first.job.id}/flush-order`, { radiatorIndexes: [4, 3, 2, 0, 1] });
    expect(set.status).toBe(200);
    expect(set.body.sheet.flushOrder).toEqual({ radiatorIndexes: [4, 3, 2, 0, 1], from: 'site' });
    const site = await t.deps.db('sites').where({ id: firm.siteId }).first('flush_order');
    expect(typeof site.flush_order === 'string' ? JSON.parse(site.flush_order) : site.flush_order).toEqual([
      'Bathroom',
      'Bedroom 2',
      'Bedroom 1',
      'Lounge',
      'Kitchen',
    ]);

    // Next year's visit: the survey entered afresh, in another order, with a new radiator.
    const nextRooms = ['Kitchen', 'Lounge', 'Bathroom', 'Bedroom 1', 'Bedroom 2', 'Conservatory'];
    const next = (
      await engineer.post('/api/jobs', {
        siteId: firm.siteId,
        scheduledOn: '2027-12-15',
        survey: { ...survey, radiators: nextRooms.map((room) => ({ room, panel: 'single' })) },
      })
    ).body;
    expect(next.sheet.flushOrder).toEqual({ radiatorIndexes: [2, 4, 3, 1, 0, 5], from: 'site' });

    const partial = await engineer.put(`/api/jobs/${first.job.id}/flush-order`, { radiatorIndexes: [4, 3, 2] });
    expect(partial.status).toBe(422);
    expect(partial.body.message).toBe(
      'Put every radiator of the survey in the order once: 5 radiators, numbered 0 to 4.',
    );
    expect(
      (await engineer.put(`/api/jobs/${first.job.id}/flush-order`, { radiatorIndexes: [4, 4, 2, 0, 1] })).status,
    ).toBe(422);
  });
});
