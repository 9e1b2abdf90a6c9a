import type { Readable } from 'node:stream';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, signIn, type Client, type TestApp } from './support/test-app.ts';
import { seedFirm } from './support/seed-firm.ts';
import { tinyPng } from './support/route-probes.ts';
import { setUpJobSheet } from './support/job-sheet-setup.ts';

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

/** Moves the test clock to an instant (the clock only moves by offsets). */
const setNow = (iso: string) => t.clock.advance(Date.parse(iso) - t.clock.now().getTime());

async function pdfText(pdf: Buffer): Promise<string> {
  const { PDFParse } = await import('pdf-parse');
  return (await new PDFParse({ data: new Uint8Array(pdf) }).getText()).text.replace(/\s+/g, ' ');
}

async function download(client: Client, url: string): Promise<{ status: number; type: string; text: string }> {
  const res = await client
    .get(url)
    .buffer(true)
    .parse((r, cb) => {
      const parts: Buffer[] = [];
      r.on('data', (c: Buffer) => parts.push(c));
      r.on('end', () => cb(null, Buffer.concat(parts)));
    });
  return {
    status: res.status,
    type: String(res.headers['content-type']),
    text: res.status === 200 ? await pdfText(res.body as Buffer) : '',
  };
}

async function storedAttachment(firmId: number): Promise<string> {
  const row = await t.deps.db('emails').where({ firm_id: firmId, purpose: 'job-report' }).first('attachment_key');
  const parts: Buffer[] = [];
  for await (const p of (await t.deps.objectStore.get(row.attachment_key as string)) as Readable)
    parts.push(p as Buffer);
  return pdfText(Buffer.concat(parts));
}

const ok = (res: { status: number; body: unknown }) => expect(res.status, JSON.stringify(res.body)).toBeLessThan(300);
const signature = `data:image/png;base64,${tinyPng.toString('base64')}`;

describe("the customer's report and the firm's record", () => {
  it("prints the firm's contact details, report number, pages, UK dates in the firm's zone, the result, signatures and reasons; the record keeps the vibration points and asset tags", async () => {
    const s = await setUpJobSheet(t, 'report-customer');
    let owner = await signIn(t.app, s.firm.people.owner.email);
    ok(
      await owner.put('/api/firm', {
        name: s.firm.firmName,
        address: '4 Yard Row\nBrackenford',
        timeZone: 'Europe/London',
        volumeUnit: 'litres',
        coldBottomThresholdK: 10,
        phone: '01632 960123',
        email: 'office@report-firm.example',
        registrationNumbers: 'Trade scheme 000111; Gas register 222333',
      }),
    );
    ok(
      await owner.patch(`/api/jobs/${s.jobId}`, {
        systemDetails: {
          boilerMake: 'Examplemake',
          boilerModel: 'Model 30',
          boilerLocation: 'Kitchen cupboard',
          magneticFilterFitted: true,
        },
      }),
    );
    const assetTag = (await t.deps.db('kit_items').where({ id: s.toolId }).first('asset_tag')).asset_tag as string;
    await t.deps.db('products').where({ id: s.inhibitorId }).update({ test_method: 'Drop test kit, counted drops' });

    // 23:20 UTC on 1 July 2027 is 00:20 on 2 July in London (BST): the report must print the firm's day.
    // Sessions end when the clock jumps: sign in again after each jump.
    setNow('2027-07-01T23:20:00Z');
    let e = await signIn(t.app, s.firm.people.engineer.email);
    ok(
      await e.post(`/api/jobs/${s.jobId}/signatures`, {
        kind: 'acknowledgement',
        name: 'Pat Householder',
        imagePngDataUrl: signature,
      }),
    );
    for (const step of ['depressurise', 'isolate_connect', 'dose_cleaner', 'circulate_hot'])
      ok(await e.put(`/api/jobs/${s.jobId}/steps/${step}`, { done: true }));
    ok(await e.put(`/api/jobs/${s.jobId}/radiators/0/readings/before`, { topC: 58, bottomC: 40 }));
    ok(await e.put(`/api/jobs/${s.jobId}/radiators/0/agitation`, { minutes: 30, kitItemId: s.toolId }));
    t.clock.advance(90 * 60_000);
    e = await signIn(t.app, s.firm.people.engineer.email);
    owner = await signIn(t.app, s.firm.people.owner.email);
    ok(await e.put(`/api/jobs/${s.jobId}/radiators/0/flushed`, { done: true }));
    ok(await e.put(`/api/jobs/${s.jobId}/steps/flush`, { done: true }));
    ok(await e.put(`/api/jobs/${s.jobId}/radiators/0/readings/after`, { topC: 70, bottomC: 66 }));
    ok(
      await e.put(`/api/jobs/${s.jobId}/water-tests`, {
        mainsTdsPpm: 200,
        systemTdsPpm: 210,
        waterClear: true,
        inhibitorReading: 1.2,
        inhibitorProductId: s.inhibitorId,
      }),
    );
    ok(await e.put(`/api/jobs/${s.jobId}/kit`, { kitItemIds: [s.toolId] }));
    ok(
      await e.upload(
        `/api/jobs/${s.jobId}/photos`,
        { tag: 'thermal_image', caption: 'Lounge warm to the bottom' },
        { field: 'photo', content: tinyPng, filename: 't.png', contentType: 'image/png' },
      ),
    );
    ok(
      await e.post(`/api/jobs/${s.jobId}/signatures`, {
        kind: 'acceptance',
        name: 'Sam Householder',
        imagePngDataUrl: signature,
      }),
    );

    // The landing has neither after readings nor a flush tick: completing asks for the reasons first.
    const refused = await e.post(`/api/jobs/${s.jobId}/complete`, {});
    expect(refused.status).toBe(422);
    const sheet = (await e.get(`/api/jobs/${s.jobId}`)).body.sheet as { completionIssues: { code: string }[] };
    const reasons: Record<string, string> = {
      after_readings_missing: 'The landing radiator was boxed in behind a fitted cupboard.',
      flush_ticks_missing: 'The landing radiator could not be reached to flush it on its own.',
    };
    const confirmations = sheet.completionIssues.map((i) => ({
      code: i.code,
      reason: reasons[i.code] ?? 'Agreed with the householder on the day.',
    }));
    expect(confirmations.map((c) => c.code)).toEqual(expect.arrayContaining(Object.keys(reasons)));
    const recommendation = 'Have the landing radiator flushed once the cupboard is moved.';
    const done = await e.post(`/api/jobs/${s.jobId}/complete`, { confirmations, recommendation });
    ok(done);
    const reportNumber = done.body.job.reportNumber as string;
    expect(reportNumber).toMatch(/^HF-\d{6}$/);

    const customer = await download(owner, `/api/jobs/${s.jobId}/customer-report.pdf`);
    expect(customer.status).toBe(200);
    expect(customer.type).toBe('application/pdf');
    const c = customer.text;
    for (const expected of [
      s.firm.firmName,
      '4 Yard Row, Brackenford',
      '01632 960123',
      'office@report-firm.example',
      'Trade scheme 000111; Gas register 222333',
      `Report number ${reportNumber}`,
      'Page 1 of',
      'Date: 2 July 2027',
      'Started: 00:20',
      'Finished: 01:50',
      // The result box, first.
      'System cleaned Yes',
      'Flush complete Yes',
      'Inhibitor at target Yes: reading 1.2 % v/v',
      `Recommended ${recommendation}`,
      'Next inhibitor check by 2 July 2028',
      // The system, the chemicals with pack sizes and lots, the test method.
      'Make and model: Examplemake Model 30',
      'Boiler location: Kitchen cupboard',
      'Magnetic filter fitted: Yes',
      '1 litre',
      s.firm.product.lotNumber,
      'Drop test kit, counted drops',
      'Thermal image: Lounge warm to the bottom',
      // Signatures with names and times, the reasons, the safety note.
      'Pat Householder, signed 2 July 2027 at 00:20',
      'Sam Householder, signed 2 July 2027 at 01:50',
      reasons.after_readings_missing,
      reasons.flush_ticks_missing,
      'Keeping safe',
      'Only a Gas Safe registered engineer may work on a gas boiler',
    ])
      expect(c, expected).toContain(expected);
    expect(c).not.toContain('1 July 2027');
    expect(c).not.toMatch(/vibration/i);
    expect(c).not.toContain(assetTag);
    // Instructions meant for the engineer stay off it.
    expect(c).not.toContain('Isolate the boiler');
    expect(c).not.toContain('prove it dead');
    // The radiator table: top, bottom, cold bottom and output (the lounge's rated output is known) before,
    // minutes worked, flushed at, and the same after; the landing, never read, shows dashes.
    expect(c).toContain('Before: top');
    expect(c).toMatch(/Lounge 58\.0 40\.0 yes \d+ 30 01:50 70\.0 66\.0 no \d+/);
    expect(c).toMatch(/Landing( -){10}/);

    // The completion e-mail attaches the customer's report, not the record.
    const attached = await storedAttachment(s.firm.firmId);
    expect(attached).toContain(`Report number ${reportNumber}`);
    expect(attached).not.toMatch(/vibration/i);

    // The firm's record keeps everything.
    const record = await download(owner, `/api/jobs/${s.jobId}/report.pdf`);
    expect(record.status).toBe(200);
    expect(record.text).toContain('hand-arm vibration points on this visit');
    expect(record.text).toContain(assetTag);
    expect(record.text).toContain(reportNumber);
    expect(record.text).toContain('Pat Householder');
    expect(record.text).toContain(reasons.after_readings_missing);
  });

  it('an inhibitor visit with nothing recorded: no radiator table, the tests "Not tested", the reasons printed', async () => {
    const firm = await seedFirm(t.deps.db, 'report-inhibitor');
    const engineer = await signIn(t.app, firm.people.engineer.email);
    ok(await engineer.patch(`/api/jobs/${firm.jobId}`, { visitKind: 'inhibitor_only' }));
    const refused = await engineer.post(`/api/jobs/${firm.jobId}/complete`, {});
    expect(refused.status).toBe(422);
    const sheet = (await engineer.get(`/api/jobs/${firm.jobId}`)).body.sheet as {
      completionIssues: { code: string }[];
    };
    const confirmations = sheet.completionIssues.map((i) => ({
      code: i.code,
      reason: `Householder asked us to stop (${i.code}).`,
    }));
    ok(await engineer.post(`/api/jobs/${firm.jobId}/complete`, { confirmations }));
    const { text } = await download(engineer, `/api/jobs/${firm.jobId}/customer-report.pdf`);
    expect(text).toContain('Heating system inhibitor report');
    expect(text).toContain('System cleaned Not part of this visit');
    expect(text).toContain('Inhibitor at target Not tested');
    expect(text).toContain('Have the inhibitor level tested: it was not tested on this visit.');
    expect(text).toContain('No water test was taken on this visit.');
    expect(text).not.toContain('Cleaning can show up');
    expect(text).not.toContain('Before: top');
    for (const c of confirmations) expect(text).toContain(c.reason);
    expect(text).toMatch(/Page 1 of \d/);
  });

  it('is refused to another firm (404), like the record', async () => {
    const firm = await seedFirm(t.deps.db, 'report-other');
    const stranger = await seedFirm(t.deps.db, 'report-stranger');
    const owner = await signIn(t.app, stranger.people.owner.email);
    expect((await owner.get(`/api/jobs/${firm.jobId}/customer-report.pdf`)).status).toBe(404);
    expect((await owner.get(`/api/jobs/${firm.jobId}/report.pdf`)).status).toBe(404);
  });
});
