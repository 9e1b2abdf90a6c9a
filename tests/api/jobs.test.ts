import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { completionCodes } from '@heatfleet/domain';
import { randomUUID } from 'node:crypto';
import { createTestApp, signIn, type TestApp } from './support/test-app.ts';
import { seedFirm } from './support/seed-firm.ts';
import { startTestEmailWorker } from './support/email-worker.ts';
import { waitForEmail } from './support/outbox.ts';
import { readFile } from 'node:fs/promises';
import path from 'node:path';

/** A reason for everything the completion guard could ask about: these tests are about what completion does, not the guard (visit-completion.test.ts). */
const allReasons = { confirmations: completionCodes.map((code) => ({ code, reason: 'Not the point of this test' })) };

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

const measuredSurvey = {
  systemType: 'sealed',
  boilerKind: 'system',
  fuel: 'gas',
  heatExchangerLitres: 2,
  cylinderCoilLitres: 5,
  radiators: [
    { room: 'Lounge', panel: 'double', heightMm: 600, lengthMm: 1400 },
    { room: 'Kitchen', panel: 'single', heightMm: 600, lengthMm: 1000 },
    { room: 'Bathroom', panel: 'towel_rail', litres: 3 },
  ],
  pipeRuns: [
    { tube: '15', lengthM: 40 },
    { tube: '22', lengthM: 10 },
  ],
};

describe('jobs', () => {
  it('computes the volume part by part and the dose plan, and checks the van', async () => {
    const firm = await seedFirm(t.deps.db, 'job-plan');
    const engineer = await signIn(t.app, firm.people.engineer.email);
    const res = await engineer.post('/api/jobs', {
      siteId: firm.siteId,
      scheduledOn: '2026-12-12',
      productIds: [firm.product.id],
      survey: measuredSurvey,
    });
    expect(res.status).toBe(201);
    // Radiators: 6 x 1.4 + 3 x 1.0 + 3 = 14.4 L (about 3 and 6 L/m at 600 mm: from memory).
    // Pipework (EN 1057): 40 x 0.14527 + 10 x 0.32047 = 9.0155 L. Total with 2 + 5 = 30.4155 L.
    expect(res.body.volume.radiatorsLitres).toBeCloseTo(14.4, 6);
    expect(res.body.volume.pipeworkLitres).toBeCloseTo(9.0155, 3);
    expect(res.body.volume.totalLitres).toBeCloseTo(30.4155, 3);
    expect(res.body.volume.estimate).toBe(false);
    // 1 L per 100 L, 1 L packs: 0.304 L -> 1 pack; no radiators rule on this product.
    const [dose] = res.body.doses;
    expect(dose).toMatchObject({ packsByVolume: 1, packs: 1, decidedBy: 'volume', shortfall: 0 });
    expect(dose.takeFromVan).toEqual([expect.objectContaining({ batchId: firm.product.batchId, quantity: 1 })]);
  });

  it('falls back to the quick estimate when the survey is short, and says so', async () => {
    const firm = await seedFirm(t.deps.db, 'job-estimate');
    const stores = await signIn(t.app, firm.people.stores.email);
    const survey = {
      systemType: 'open_vented',
      boilerKind: 'regular',
      fuel: 'oil',
      radiators: Array.from({ length: 18 }, (_, i) => ({ room: `Room ${i}`, panel: i < 4 ? 'double' : 'single' })),
      pipeRuns: [],
    };
    await t.deps.db('products').where({ id: firm.product.id }).update({ radiators_per_pack: 10 });
    const res = await stores.post('/api/jobs', {
      siteId: firm.siteId,
      scheduledOn: '2026-12-12',
      engineerMemberId: firm.people.engineer.memberId,
      productIds: [firm.product.id],
      survey,
    });
    expect(res.status).toBe(201);
    // 22 single-panel equivalents x 10 L = 220 L (common trade practice), plus 15 L for a regular oil boiler (from memory).
    expect(res.body.volume).toMatchObject({
      estimate: true,
      label: 'Estimated',
      radiatorsLitres: 220,
      heatExchangerLitres: 15,
      totalLitres: 235,
    });
    // 235 L at 1 L/100 L is 2.35 L -> 3 packs; 18 radiators at one pack per 10 -> 2 packs: volume wins.
    expect(res.body.doses[0]).toMatchObject({ packsByVolume: 3, packsByRadiators: 2, packs: 3, decidedBy: 'volume' });
    // The van holds 2: one short.
    expect(res.body.doses[0].shortfall).toBe(1);
  });

  it('completion takes the chemicals off the van by batch exactly once, and sets the annual check', async () => {
    const firm = await seedFirm(t.deps.db, 'job-complete');
    const engineer = await signIn(t.app, firm.people.engineer.email);
    await engineer.refreshCsrf();
    const key = randomUUID();
    const send = () =>
      engineer.agent
        .post(`/api/jobs/${firm.jobId}/complete`)
        .set('X-CSRF-Token', engineer.csrfToken)
        .set('Idempotency-Key', key)
        .send(allReasons);
    const [a, b] = await Promise.all([send(), send()]);
    expect([a.status, b.status]).toEqual([200, 200]);
    expect(b.body).toEqual(a.body);
    expect(a.body.job.status).toBe('completed');
    expect(a.body.chemicalsUsed).toEqual([expect.objectContaining({ lotNumber: firm.product.lotNumber, packs: 1 })]);
    const used = await t.deps.db('stock_movements').where({ firm_id: firm.firmId, job_id: firm.jobId, kind: 'used' });
    expect(used).toHaveLength(1);
    const van = await t.deps
      .db('stock_balances')
      .where({ firm_id: firm.firmId, location_id: firm.van.id, batch_id: firm.product.batchId })
      .first();
    expect(van.quantity).toBe(1);
    // A completion sent again without the key changes nothing.
    const again = await engineer.post(`/api/jobs/${firm.jobId}/complete`, allReasons);
    expect(again.status).toBe(409);
    expect(await t.deps.db('stock_movements').where({ firm_id: firm.firmId, job_id: firm.jobId })).toHaveLength(1);
    const site = await t.deps.db('sites').where({ id: firm.siteId }).first();
    expect(site.next_check_on).toBe(a.body.job.nextCheckOn);
  });

  it('only the job\u2019s own engineer (or the office) may complete it', async () => {
    const firm = await seedFirm(t.deps.db, 'job-own');
    const other = await signIn(t.app, firm.target.email);
    expect((await other.post(`/api/jobs/${firm.jobId}/complete`, allReasons)).status).toBe(403);
    expect(await t.deps.db('stock_movements').where({ firm_id: firm.firmId, job_id: firm.jobId })).toHaveLength(0);
  });
});

describe('the completion report', () => {
  it('is a PDF with the firm, the volume and how it was reached, the chemicals by lot and the cautions', async () => {
    const { PDFParse } = await import('pdf-parse');
    const firm = await seedFirm(t.deps.db, 'job-report');
    const engineer = await signIn(t.app, firm.people.engineer.email);
    await engineer.post(`/api/jobs/${firm.jobId}/complete`, allReasons).then((r) => expect(r.status).toBe(200));
    const res = await engineer
      .get(`/api/jobs/${firm.jobId}/report.pdf`)
      .buffer(true)
      .parse((r, cb) => {
        const parts: Buffer[] = [];
        r.on('data', (c: Buffer) => parts.push(c));
        r.on('end', () => cb(null, Buffer.concat(parts)));
      });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const text = (await new PDFParse({ data: new Uint8Array(res.body as Buffer) }).getText()).text.replace(/\s+/g, ' ');
    expect(text).toContain(firm.firmName);
    expect(text).toContain('System water volume');
    // One single panel on the quick estimate: 10 L, plus 1 L for a combi's heat exchanger (from memory).
    expect(text).toContain('11.0 litres');
    expect(text).toContain(`lot ${firm.product.lotNumber}`);
    expect(text).toContain('Gas Safe Register');
    expect(text).toContain('foul drain');
  });
});

describe('the report e-mail', () => {
  it('goes to the customer with the PDF attached when the job is completed', async () => {
    const worker = startTestEmailWorker(t);
    try {
      const firm = await seedFirm(t.deps.db, 'job-mail');
      const customer = (await t.deps.db('customers').where({ id: firm.customerId }).first('email')).email as string;
      const engineer = await signIn(t.app, firm.people.engineer.email);
      await engineer.post(`/api/jobs/${firm.jobId}/complete`, allReasons).then((r) => expect(r.status).toBe(200));
      const mail = await waitForEmail(customer, { subject: /cleaning report/ });
      expect(mail.text).toContain('The report is attached');
      const raw = await readFile(path.join(process.env.OUTBOX_DIR!, `${mail.id}.eml`), 'utf8');
      expect(raw).toMatch(/Content-Type: application\/pdf; name=cleaning-report-\d+\.pdf/);
      const row = await t.deps.db('emails').where({ firm_id: firm.firmId, purpose: 'job-report' }).first();
      expect(row.attachment_key.startsWith(`firms/${firm.firmId}/reports/`)).toBe(true);
    } finally {
      await worker.close();
    }
  });
});
