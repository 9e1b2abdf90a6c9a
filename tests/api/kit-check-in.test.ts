import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, signIn, type TestApp } from './support/test-app.ts';
import { seedFirm, type SeededFirm } from './support/seed-firm.ts';

// The check-in of a kit: each item its own condition (in service unless said), the depot it returns to,
// and a "cleaned" tick for kinds inspected after use. The due rule is DEVELOPERS.md, Product rules
// (inspection due): a use is a check-in; a kind inspected after every use (the default magnet set: after
// 1 use, due soon 0 days, common practice (no source)) is overdue after its use until cleaned.

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

const kindId = async (firm: SeededFirm, name: string) =>
  ((await t.deps.db('item_kinds').where({ firm_id: firm.firmId, name }).first('id')) as { id: number }).id;

/** A kit of a magnet set, a hose set and a manifold, at the firm's depot. */
async function magnetKit(firm: SeededFirm) {
  const [kitId] = (await t.deps.db('kits').insert({ firm_id: firm.firmId, name: `Magnet kit ${firm.firmId}` })) as [
    number,
  ];
  const tags = { magnet: `MAG-${firm.firmId}`, hose: `HOS-${firm.firmId}`, manifold: `MAN-${firm.firmId}` };
  const kinds = { magnet: 'Magnet set', hose: 'Hose set', manifold: 'Manifold and connectors' } as const;
  const ids = {} as Record<keyof typeof tags, number>;
  for (const part of ['magnet', 'hose', 'manifold'] as const) {
    const [id] = (await t.deps.db('kit_items').insert({
      firm_id: firm.firmId,
      kit_id: kitId,
      kind_id: await kindId(firm, kinds[part]),
      asset_tag: tags[part],
      location_id: firm.depotId,
      in_service_since: '2026-11-01',
    })) as [number];
    ids[part] = id;
  }
  return { kitId, ids };
}

async function secondDepot(firm: SeededFirm) {
  const [id] = (await t.deps.db('locations').insert({
    firm_id: firm.firmId,
    kind: 'depot',
    name: `North yard ${firm.firmId}`,
  })) as [number];
  return id;
}

/** The answer, once it is known to be a 200 (the body is shown when it is not). */
async function ok(sent: Promise<{ status: number; body: unknown }>) {
  const res = await sent;
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res as { status: number; body: { items: ItemState[] } };
}

type ItemState = {
  id: number;
  condition: string;
  location: { id: number } | null;
  inspection: { state: string; usesSinceInspection: number };
};
const byId = (items: ItemState[], id: number) => items.find((i) => i.id === id)!;

describe('kit check-in', () => {
  it('each item keeps its own condition, in service by default, and the kit goes to the depot chosen', async () => {
    const firm = await seedFirm(t.deps.db, 'checkin-each');
    const { kitId, ids } = await magnetKit(firm);
    const north = await secondDepot(firm);
    const engineer = await signIn(t.app, firm.people.engineer.email);
    await ok(engineer.post(`/api/kits/${kitId}/check-out`, { toLocationId: firm.van.id }));
    const res = await engineer.post(`/api/kits/${kitId}/check-in`, {
      toLocationId: north,
      items: [{ itemId: ids.hose, condition: 'needs_attention' }],
      missingParts: 'One hose clip',
    });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const items = res.body.items as ItemState[];
    expect(byId(items, ids.hose).condition).toBe('needs_attention');
    expect(byId(items, ids.magnet).condition).toBe('in_service');
    expect(byId(items, ids.manifold).condition).toBe('in_service');
    expect(items.every((i) => i.location?.id === north)).toBe(true);
    const events = await t.deps
      .db('custody_events')
      .where({ firm_id: firm.firmId, kit_id: kitId, action: 'check_in' })
      .select('item_id', 'condition', 'to_location_id');
    expect(events).toHaveLength(3);
    expect(events.find((e) => e.item_id === ids.hose)).toMatchObject({
      condition: 'needs_attention',
      to_location_id: north,
    });
  });

  it('the magnet set is overdue after a check-in without the cleaned tick, and in date after one with it', async () => {
    const firm = await seedFirm(t.deps.db, 'checkin-clean');
    const { kitId, ids } = await magnetKit(firm);
    const engineer = await signIn(t.app, firm.people.engineer.email);
    await ok(engineer.post(`/api/kits/${kitId}/check-out`, { toLocationId: firm.van.id }));
    const plain = await ok(engineer.post(`/api/kits/${kitId}/check-in`, {}));
    expect(byId(plain.body.items, ids.magnet).inspection).toMatchObject({ state: 'overdue', usesSinceInspection: 1 });
    // Overdue and "may go out with a reason": refused without one.
    const refused = await engineer.post(`/api/kits/${kitId}/check-out`, { toLocationId: firm.van.id });
    expect(refused.status).toBe(409);
    expect(refused.body.error).toBe('InspectionOverdue');

    await ok(
      engineer.post(`/api/kits/${kitId}/check-out`, { toLocationId: firm.van.id, overdueReason: 'Cleaned on the van' }),
    );
    const cleaned = await engineer.post(`/api/kits/${kitId}/check-in`, {
      items: [{ itemId: ids.magnet, cleaned: true }],
    });
    expect(cleaned.status, JSON.stringify(cleaned.body)).toBe(200);
    expect(byId(cleaned.body.items, ids.magnet).inspection).toMatchObject({ state: 'ok', usesSinceInspection: 0 });
    // The tick is recorded: on the custody event and as an inspection marked as cleaned at check-in.
    const event = cleaned.body.events.find(
      (e: { item: { id: number }; action: string }) => e.item.id === ids.magnet && e.action === 'check_in',
    );
    expect(event.cleaned).toBe(true);
    expect(cleaned.body.inspections).toEqual([
      expect.objectContaining({ itemId: ids.magnet, result: 'passed', cleanedAtCheckIn: true, electrical: null }),
    ]);
    // And the kit may go out again without a reason.
    await ok(engineer.post(`/api/kits/${kitId}/check-out`, { toLocationId: firm.van.id }));
  });

  it('refuses the tick on a kind without an after-use rule, and an item not in the kit, changing nothing', async () => {
    const firm = await seedFirm(t.deps.db, 'checkin-refuse');
    const { kitId, ids } = await magnetKit(firm);
    const engineer = await signIn(t.app, firm.people.engineer.email);
    await ok(engineer.post(`/api/kits/${kitId}/check-out`, { toLocationId: firm.van.id }));
    const noRule = await engineer.post(`/api/kits/${kitId}/check-in`, {
      items: [{ itemId: ids.manifold, cleaned: true }],
    });
    expect(noRule.status).toBe(400);
    expect(noRule.body.message).toBe(
      `MAN-${firm.firmId} (Manifold and connectors) has no after-use rule, so it is not ticked as cleaned; record an inspection instead.`,
    );
    const stray = await engineer.post(`/api/kits/${kitId}/check-in`, {
      items: [{ itemId: firm.looseItemId, condition: 'out_of_service' }],
    });
    expect(stray.status).toBe(400);
    expect(stray.body.message).toBe(`Item ${firm.looseItemId} is not among the items being checked in.`);
    const twice = await engineer.post(`/api/kits/${kitId}/check-in`, {
      items: [
        { itemId: ids.hose, condition: 'in_service' },
        { itemId: ids.hose, condition: 'out_of_service' },
      ],
    });
    expect(twice.status).toBe(422);
    const rows = await t.deps.db('kit_items').whereIn('id', Object.values(ids)).select('location_id', 'condition');
    expect(rows.every((r) => r.location_id === firm.van.id && r.condition === 'in_service')).toBe(true);
    expect(await t.deps.db('inspections').whereIn('item_id', Object.values(ids)).count({ n: '*' })).toEqual([{ n: 0 }]);
  });

  it("another firm's depot, or a van given as the depot, is not found", async () => {
    const firm = await seedFirm(t.deps.db, 'checkin-depot');
    const other = await seedFirm(t.deps.db, 'checkin-other');
    const { kitId } = await magnetKit(firm);
    const engineer = await signIn(t.app, firm.people.engineer.email);
    await ok(engineer.post(`/api/kits/${kitId}/check-out`, { toLocationId: firm.van.id }));
    expect((await engineer.post(`/api/kits/${kitId}/check-in`, { toLocationId: other.depotId })).status).toBe(404);
    expect((await engineer.post(`/api/kits/${kitId}/check-in`, { toLocationId: firm.spareVanId })).status).toBe(404);
    const where = await t.deps.db('kit_items').where({ kit_id: kitId }).distinct('location_id');
    expect(where).toEqual([{ location_id: firm.van.id }]);
  });
});
