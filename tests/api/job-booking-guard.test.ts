import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, signIn, type TestApp } from './support/test-app.ts';
import { seedFirm, type SeededFirm } from './support/seed-firm.ts';

// Issue 10: an engineer could book a job for another member, even an Owner, and the job took that
// member's van. An engineer books for themself only; whoever is named must be an active engineer of the firm.

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

const survey = {
  systemType: 'sealed',
  boilerKind: 'combi',
  fuel: 'gas',
  radiators: [{ room: 'Hall', panel: 'single' }],
  pipeRuns: [],
};
const booking = (firm: SeededFirm, engineerMemberId?: number | null) => ({
  siteId: firm.siteId,
  scheduledOn: '2026-12-18',
  productIds: [firm.product.id],
  survey,
  ...(engineerMemberId === undefined ? {} : { engineerMemberId }),
});

async function jobCount(firmId: number): Promise<number> {
  const row = (await t.deps.db('jobs').where({ firm_id: firmId }).count({ n: '*' }).first()) as { n: number | string };
  return Number(row.n);
}

describe('who a job is booked for', () => {
  it('an engineer cannot book a job for an Owner, nor take the Owner\u2019s van', async () => {
    const firm = await seedFirm(t.deps.db, 'book-owner');
    // The Owner has a van of their own: a booking in their name would take it.
    const [ownerVan] = (await t.deps.db('locations').insert({
      firm_id: firm.firmId,
      kind: 'van',
      name: 'Owner van',
      registration: `OW${firm.firmId}VAN`,
      engineer_member_id: firm.people.owner.memberId,
    })) as number[];
    const engineer = await signIn(t.app, firm.people.engineer.email);
    const before = await jobCount(firm.firmId);
    const res = await engineer.post('/api/jobs', booking(firm, firm.people.owner.memberId));
    expect(res.status).toBe(403);
    expect(res.body.message).toMatch(/themself/);
    expect(await jobCount(firm.firmId)).toBe(before);
    expect(await t.deps.db('jobs').where({ firm_id: firm.firmId, van_location_id: ownerVan })).toHaveLength(0);
  });

  it('an engineer cannot book a job for another engineer', async () => {
    const firm = await seedFirm(t.deps.db, 'book-other');
    const engineer = await signIn(t.app, firm.people.engineer.email);
    const before = await jobCount(firm.firmId);
    expect((await engineer.post('/api/jobs', booking(firm, firm.target.memberId))).status).toBe(403);
    expect(await jobCount(firm.firmId)).toBe(before);
  });

  it('an engineer books for themself, named or not, and the job takes their van', async () => {
    const firm = await seedFirm(t.deps.db, 'book-self');
    const engineer = await signIn(t.app, firm.people.engineer.email);
    for (const named of [undefined, null, firm.people.engineer.memberId]) {
      const res = await engineer.post('/api/jobs', booking(firm, named));
      expect(res.status).toBe(201);
      expect(res.body.job).toMatchObject({
        engineerMemberId: firm.people.engineer.memberId,
        vanLocationId: firm.van.id,
      });
    }
  });

  it('the office may name an active engineer, or nobody yet', async () => {
    const firm = await seedFirm(t.deps.db, 'book-office');
    const stores = await signIn(t.app, firm.people.stores.email);
    const named = await stores.post('/api/jobs', booking(firm, firm.people.engineer.memberId));
    expect(named.status).toBe(201);
    expect(named.body.job).toMatchObject({
      engineerMemberId: firm.people.engineer.memberId,
      vanLocationId: firm.van.id,
    });
    const nobody = await stores.post('/api/jobs', booking(firm));
    expect(nobody.status).toBe(201);
    expect(nobody.body.job).toMatchObject({ engineerMemberId: null, vanLocationId: null });
  });

  it('the office cannot name a member who is not an engineer, or no longer active', async () => {
    const firm = await seedFirm(t.deps.db, 'book-role');
    const owner = await signIn(t.app, firm.people.owner.email);
    const before = await jobCount(firm.firmId);
    for (const role of ['owner', 'admin', 'stores'] as const) {
      const res = await owner.post('/api/jobs', booking(firm, firm.people[role].memberId));
      expect(res.status).toBe(400);
      expect(res.body.message).toMatch(/not an engineer/);
      expect(res.body.details).toEqual([expect.objectContaining({ path: 'engineerMemberId' })]);
    }
    await t.deps.db('memberships').where({ firm_id: firm.firmId, id: firm.target.memberId }).update({ active: false });
    const inactive = await owner.post('/api/jobs', booking(firm, firm.target.memberId));
    expect(inactive.status).toBe(400);
    expect(inactive.body.message).toMatch(/no longer active/);
    expect(await jobCount(firm.firmId)).toBe(before);
  });

  it('another firm\u2019s engineer is not found', async () => {
    const firm = await seedFirm(t.deps.db, 'book-home');
    const other = await seedFirm(t.deps.db, 'book-away');
    const owner = await signIn(t.app, firm.people.owner.email);
    const before = await jobCount(firm.firmId);
    const res = await owner.post('/api/jobs', booking(firm, other.people.engineer.memberId));
    expect(res.status).toBe(404);
    expect(res.body.message).toBe('That engineer was not found.');
    expect(await jobCount(firm.firmId)).toBe(before);
    expect(
      await t.deps.db('jobs').where({ engineer_member_id: other.people.engineer.memberId, firm_id: firm.firmId }),
    ).toHaveLength(0);
  });
});
