import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, signIn, type TestApp } from './support/test-app.ts';
import { seedFirm, type SeededFirm } from './support/seed-firm.ts';

// An electrical kind's in-service inspection and test, after the IET Code of Practice for In-service
// Inspection and Testing of Electrical Equipment (5th edition, 2020; limits from memory): Class I earth
// continuity at most 0.1 ohm plus the cord, insulation resistance at least 1 megohm (Class I) or 2 (Class II);
// Class II has no earth continuity test. A failed test takes the item out of service.

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

async function item(firm: SeededFirm, kind: string) {
  const kindRow = await t.deps.db('item_kinds').where({ firm_id: firm.firmId, name: kind }).first('id');
  const [id] = (await t.deps.db('kit_items').insert({
    firm_id: firm.firmId,
    kind_id: kindRow.id,
    asset_tag: `EL-${kind.slice(0, 3).toUpperCase()}-${firm.firmId}`,
    location_id: firm.depotId,
    in_service_since: '2026-11-01',
  })) as [number];
  return id;
}

const test = {
  equipmentClass: 'I',
  visual: 'pass',
  earthContinuityOhms: 0.12,
  cordLengthM: 5,
  cordSizeMm2: 1.5,
  insulationResistanceMohms: 150,
  polarity: 'not_applicable',
  testerUsed: 'Tester 2, serial 0042',
  testerCalibratedOn: '2026-06-15',
};

describe('electrical inspection and test', () => {
  it('a Class I pump inside the limits passes, with the limits it was judged by', async () => {
    const firm = await seedFirm(t.deps.db, 'elec-pass');
    const pump = await item(firm, 'Flushing pump');
    const stores = await signIn(t.app, firm.people.stores.email);
    const res = await stores.post(`/api/kit-items/${pump}/inspections`, { result: 'passed', electrical: test });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    // 0.1 + 5 m x 13.3 milliohms per metre = 0.1665, to three places 0.167 ohm.
    expect(res.body.inspection.electrical).toMatchObject({
      ...test,
      result: 'pass',
      earthLimitOhms: 0.167,
      insulationMinMohms: 1,
      failures: [],
    });
    expect(res.body.item).toMatchObject({ condition: 'in_service', inspection: { state: 'ok' } });
    const detail = await stores.get(`/api/kit-items/${pump}`).expect(200);
    expect(detail.body.inspections[0].electrical.testerUsed).toBe('Tester 2, serial 0042');
  });

  it('a failed test recorded as failed puts the item out of service, so it cannot go out', async () => {
    const firm = await seedFirm(t.deps.db, 'elec-fail');
    const pump = await item(firm, 'Flushing pump');
    const stores = await signIn(t.app, firm.people.stores.email);
    const failing = { ...test, insulationResistanceMohms: 0.5 };
    const res = await stores.post(`/api/kit-items/${pump}/inspections`, { result: 'failed', electrical: failing });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.inspection.electrical.failures).toEqual([
      'Insulation resistance 0.5 MΩ is under the Class I minimum of 1 MΩ.',
    ]);
    expect(res.body.item.condition).toBe('out_of_service');
    const engineer = await signIn(t.app, firm.people.engineer.email);
    const out = await engineer.post(`/api/kit-items/${pump}/check-out`, { toLocationId: firm.van.id });
    expect(out.status).toBe(409);
    expect(out.body.error).toBe('OutOfService');
  });

  it('refuses a pass against a failed test, a test on a kind that is not electrical, and a tester calibrated after the test', async () => {
    const firm = await seedFirm(t.deps.db, 'elec-refuse');
    const pump = await item(firm, 'Flushing pump');
    const hose = await item(firm, 'Hose set');
    const stores = await signIn(t.app, firm.people.stores.email);
    const mismatch = await stores.post(`/api/kit-items/${pump}/inspections`, {
      result: 'passed',
      electrical: { ...test, earthContinuityOhms: 0.5 },
    });
    expect(mismatch.status).toBe(400);
    expect(mismatch.body.message).toBe(
      'The electrical test failed (Earth continuity 0.5 Ω is over the 0.167 Ω limit.) Record the inspection as failed.',
    );
    const notElectrical = await stores.post(`/api/kit-items/${hose}/inspections`, {
      result: 'passed',
      electrical: test,
    });
    expect(notElectrical.status).toBe(400);
    expect(notElectrical.body.message).toBe('Hose set is not an electrical kind, so it has no electrical test.');
    const later = await stores.post(`/api/kit-items/${pump}/inspections`, {
      result: 'passed',
      inspectedOn: '2026-11-20',
      electrical: { ...test, testerCalibratedOn: '2026-11-21' },
    });
    expect(later.status).toBe(400);
    const classII = await stores.post(`/api/kit-items/${pump}/inspections`, {
      result: 'passed',
      electrical: { ...test, equipmentClass: 'II' },
    });
    expect(classII.status).toBe(422);
    expect(JSON.stringify(classII.body)).toContain('Class II equipment has no earth: leave earth continuity empty.');
    expect(await t.deps.db('inspections').whereIn('item_id', [pump, hose]).count({ n: '*' })).toEqual([{ n: 0 }]);
    expect((await t.deps.db('kit_items').where({ id: pump }).first('condition')).condition).toBe('in_service');
  });

  it('a Class II item is tested without earth continuity and needs 2 megohms', async () => {
    const firm = await seedFirm(t.deps.db, 'elec-class2');
    const pump = await item(firm, 'Flushing pump');
    const engineer = await signIn(t.app, firm.people.engineer.email);
    const classII = { ...test, equipmentClass: 'II', earthContinuityOhms: null, cordLengthM: null, cordSizeMm2: null };
    const low = await engineer.post(`/api/kit-items/${pump}/inspections`, {
      result: 'failed',
      electrical: { ...classII, insulationResistanceMohms: 1.5 },
    });
    expect(low.status, JSON.stringify(low.body)).toBe(201);
    expect(low.body.inspection.electrical).toMatchObject({
      result: 'fail',
      earthLimitOhms: null,
      insulationMinMohms: 2,
    });
    const fine = await engineer.post(`/api/kit-items/${pump}/inspections`, {
      result: 'passed',
      electrical: { ...classII, insulationResistanceMohms: 2 },
    });
    expect(fine.status, JSON.stringify(fine.body)).toBe(201);
    expect(fine.body.inspection.electrical.result).toBe('pass');
  });
});
