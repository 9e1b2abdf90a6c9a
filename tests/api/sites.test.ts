import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays, calendarDateIn } from '@heatfleet/domain';
import { createTestApp, signIn, type TestApp } from './support/test-app.ts';
import { seedFirm, type SeededFirm } from './support/seed-firm.ts';

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

/** An inhibitor whose target range is 100 to 300 ppm (invented figures). */
async function addInhibitor(firm: SeededFirm) {
  const [id] = (await t.deps.db('products').insert({
    firm_id: firm.firmId,
    name: `Site check inhibitor ${firm.firmId}`,
    kind: 'inhibitor',
    pack_size_ml: 500,
    target_min: 100,
    target_max: 300,
    target_unit: 'ppm',
    test_method: 'Test strip',
  })) as number[];
  return id!;
}

const today = () => calendarDateIn(t.clock.now(), 'Europe/London');

describe('sites and inhibitor check visits', () => {
  it('a site shows its customer, its jobs newest first, its checks and the next check date', async () => {
    const firm = await seedFirm(t.deps.db, 'site-view');
    const survey = JSON.stringify({
      systemType: 'sealed',
      boilerKind: 'combi',
      fuel: 'gas',
      radiators: [],
      pipeRuns: [],
    });
    const [olderJob] = (await t.deps.db('jobs').insert({
      firm_id: firm.firmId,
      site_id: firm.siteId,
      scheduled_on: '2025-06-01',
      status: 'completed',
      survey,
      next_check_on: '2026-06-01',
    })) as number[];
    await t.deps.db('sites').where({ id: firm.siteId }).update({ next_check_on: '2026-06-01' });
    const engineer = await signIn(t.app, firm.people.engineer.email);
    const res = await engineer.get(`/api/sites/${firm.siteId}`);
    expect(res.status).toBe(200);
    expect(res.body.site).toMatchObject({ id: firm.siteId, nextCheckOn: '2026-06-01' });
    expect(res.body.customer).toMatchObject({ id: firm.customerId });
    expect(res.body.jobs.map((j: { id: number }) => j.id)).toEqual([firm.jobId, olderJob]);
    expect(res.body.jobs[0]).toMatchObject({ status: 'planned', engineerName: expect.stringContaining('engineer') });
    expect(res.body.checks).toEqual([]);
    expect(res.body.nextCheckOn).toBe('2026-06-01');
    const list = await engineer.get('/api/sites').expect(200);
    expect(list.body.sites).toEqual([
      {
        id: firm.siteId,
        address: res.body.site.address,
        postcode: null,
        nextCheckOn: '2026-06-01',
        customer: { id: firm.customerId, name: res.body.customer.name },
      },
    ]);
  });

  it('a reading within the target range passes, below or above it fails; a pass sets the next check a year on', async () => {
    const firm = await seedFirm(t.deps.db, 'site-check');
    const inhibitorId = await addInhibitor(firm);
    const engineer = await signIn(t.app, firm.people.engineer.email);
    const on = addDays(today(), -3);
    // The passing reading last: a failed visit brings the next check sooner (inhibitor-check-visit.test.ts).
    const cases: [number, 'pass' | 'fail'][] = [
      [99.9, 'fail'],
      [300.5, 'fail'],
      [100, 'pass'],
      [300, 'pass'],
    ];
    for (const [reading, result] of cases) {
      const res = await engineer.post(`/api/sites/${firm.siteId}/checks`, {
        checkedOn: on,
        inhibitorProductId: inhibitorId,
        inhibitorReading: reading,
        systemTdsPpm: 180,
        notes: 'Water clear',
      });
      expect(res.status, JSON.stringify(res.body)).toBe(201);
      expect(res.body.check).toMatchObject({
        inhibitorReading: reading,
        result,
        target: { min: 100, max: 300, unit: 'ppm' },
        systemTdsPpm: 180,
        notes: 'Water clear',
      });
    }
    const [y, m, d] = on.split('-');
    const site = await t.deps.db('sites').where({ id: firm.siteId }).first('next_check_on');
    // 12 calendar months on (a day the month lacks falls back to its last day).
    const expected = new Date(Date.UTC(Number(y) + 1, Number(m) - 1, 1));
    const lastDay = new Date(Date.UTC(Number(y) + 1, Number(m), 0)).getUTCDate();
    expect(site.next_check_on).toBe(
      `${expected.getUTCFullYear()}-${m}-${String(Math.min(Number(d), lastDay)).padStart(2, '0')}`,
    );
    const detail = await engineer.get(`/api/sites/${firm.siteId}`).expect(200);
    expect(detail.body.checks).toHaveLength(4);
    expect(detail.body.nextCheckOn).toBe(site.next_check_on);
  });

  it('a year on from 29 February 2028 is 28 February 2029', async () => {
    const leap = createTestApp();
    try {
      // The clock moves to March 2028 so the check is not dated in the future.
      leap.clock.advance(Date.parse('2028-03-01T12:00:00Z') - Date.now());
      const firm = await seedFirm(leap.deps.db, 'site-leap');
      const [inhibitorId] = (await leap.deps.db('products').insert({
        firm_id: firm.firmId,
        name: `Leap inhibitor ${firm.firmId}`,
        kind: 'inhibitor',
        pack_size_ml: 500,
        target_min: 100,
        target_max: 300,
      })) as number[];
      const owner = await signIn(leap.app, firm.people.owner.email);
      const res = await owner.post(`/api/sites/${firm.siteId}/checks`, {
        checkedOn: '2028-02-29',
        inhibitorProductId: inhibitorId,
        inhibitorReading: 150,
      });
      expect(res.status, JSON.stringify(res.body)).toBe(201);
      expect(res.body.site.nextCheckOn).toBe('2029-02-28');
      expect((await leap.deps.db('sites').where({ id: firm.siteId }).first('next_check_on')).next_check_on).toBe(
        '2029-02-28',
      );
    } finally {
      await leap.close();
    }
  });

  it('refuses a product that is not an inhibitor with a target range, and bad input, changing nothing', async () => {
    const firm = await seedFirm(t.deps.db, 'site-refuse');
    const [noRange] = (await t.deps.db('products').insert({
      firm_id: firm.firmId,
      name: `No range inhibitor ${firm.firmId}`,
      kind: 'inhibitor',
      pack_size_ml: 500,
    })) as number[];
    const inhibitorId = await addInhibitor(firm);
    await t.deps.db('sites').where({ id: firm.siteId }).update({ next_check_on: '2027-01-15' });
    const stores = await signIn(t.app, firm.people.stores.email);
    const on = addDays(today(), -1);
    const cleaner = await stores.post(`/api/sites/${firm.siteId}/checks`, {
      checkedOn: on,
      inhibitorProductId: firm.product.id,
      inhibitorReading: 150,
    });
    expect(cleaner.status).toBe(422);
    expect(cleaner.body.message).toContain('is not an inhibitor with a target range');
    expect(
      (
        await stores.post(`/api/sites/${firm.siteId}/checks`, {
          checkedOn: on,
          inhibitorProductId: noRange,
          inhibitorReading: 150,
        })
      ).status,
    ).toBe(422);
    const negative = await stores.post(`/api/sites/${firm.siteId}/checks`, {
      checkedOn: on,
      inhibitorProductId: inhibitorId,
      inhibitorReading: -1,
    });
    expect(negative.status).toBe(422);
    expect(negative.body.details[0].path).toContain('inhibitorReading');
    const badDate = await stores.post(`/api/sites/${firm.siteId}/checks`, {
      checkedOn: '2027-02-30',
      inhibitorProductId: inhibitorId,
      inhibitorReading: 150,
    });
    expect(badDate.status).toBe(422);
    expect(badDate.body.message).toContain('not a real date');
    const future = await stores.post(`/api/sites/${firm.siteId}/checks`, {
      checkedOn: addDays(today(), 2),
      inhibitorProductId: inhibitorId,
      inhibitorReading: 150,
    });
    expect(future.status).toBe(422);
    expect(
      (
        await stores.post(`/api/sites/${firm.siteId}/checks`, {
          checkedOn: on,
          inhibitorProductId: inhibitorId,
          inhibitorReading: 150,
          extra: 1,
        })
      ).status,
    ).toBe(422);
    expect(await t.deps.db('site_checks').where({ firm_id: firm.firmId })).toEqual([]);
    expect((await t.deps.db('sites').where({ id: firm.siteId }).first('next_check_on')).next_check_on).toBe(
      '2027-01-15',
    );
  });

  it('another firm\u2019s site and products do not exist for you', async () => {
    const a = await seedFirm(t.deps.db, 'site-iso-a');
    const b = await seedFirm(t.deps.db, 'site-iso-b');
    const aInhibitor = await addInhibitor(a);
    const bInhibitor = await addInhibitor(b);
    const bOwner = await signIn(t.app, b.people.owner.email);
    const on = addDays(today(), -1);
    expect((await bOwner.get(`/api/sites/${a.siteId}`)).status).toBe(404);
    expect(
      (
        await bOwner.post(`/api/sites/${a.siteId}/checks`, {
          checkedOn: on,
          inhibitorProductId: bInhibitor,
          inhibitorReading: 150,
        })
      ).status,
    ).toBe(404);
    // B's own site with A's inhibitor: that product is not found either.
    expect(
      (
        await bOwner.post(`/api/sites/${b.siteId}/checks`, {
          checkedOn: on,
          inhibitorProductId: aInhibitor,
          inhibitorReading: 150,
        })
      ).status,
    ).toBe(404);
    expect(await t.deps.db('site_checks').whereIn('firm_id', [a.firmId, b.firmId])).toEqual([]);
    const own = await bOwner.get(`/api/sites/${b.siteId}`).expect(200);
    expect(own.body.inhibitors.map((p: { id: number }) => p.id)).toEqual([bInhibitor]);
  });
});

describe('firm settings', () => {
  it('Owner and Admin change the firm\u2019s settings; the time zone is checked with Intl and the threshold bounded', async () => {
    const firm = await seedFirm(t.deps.db, 'firm-settings');
    const admin = await signIn(t.app, firm.people.admin.email);
    const before = await admin.get('/api/firm').expect(200);
    expect(before.body.firm).toMatchObject({
      id: firm.firmId,
      timeZone: 'Europe/London',
      volumeUnit: 'litres',
      coldBottomThresholdK: 10,
    });
    const input = {
      name: `Renamed ${firm.firmId}`,
      address: '4 Example Row, Brackenford',
      timeZone: 'Europe/Dublin',
      volumeUnit: 'imperial_gallons',
      coldBottomThresholdK: 12.5,
    };
    const saved = await admin.put('/api/firm', input);
    expect(saved.status).toBe(200);
    expect(saved.body.firm).toMatchObject({ id: firm.firmId, ...input });
    const badZone = await admin.put('/api/firm', { ...input, timeZone: 'Mars/Olympus' });
    expect(badZone.status).toBe(422);
    expect(badZone.body.message).toContain('"Mars/Olympus" is not a time zone');
    expect((await admin.put('/api/firm', { ...input, coldBottomThresholdK: 31 })).status).toBe(422);
    expect((await admin.put('/api/firm', { ...input, volumeUnit: 'pints' })).status).toBe(422);
    expect((await admin.get('/api/firm').expect(200)).body.firm).toMatchObject({ id: firm.firmId, ...input });
    const engineer = await signIn(t.app, firm.people.engineer.email);
    expect((await engineer.get('/api/firm')).status).toBe(200);
    expect((await engineer.put('/api/firm', input)).status).toBe(403);
  });
});
