import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, signIn, type TestApp } from './support/test-app.ts';
import { seedFirm } from './support/seed-firm.ts';

// Each kit item keeps its last inspection day and its uses since the last inspection (issue 16), so the kits
// pages read columns instead of counting per item. The rule counted (DEVELOPERS.md, Product rules: inspection
// due): a use is a check-in, or a completed job that listed the item; uses count after the last inspection was
// recorded. Here the kept columns are checked against a count made from the records themselves, after API writes
// and after direct writes to the records (as seeds and fixtures make).

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

async function keptAndCounted(firmId: number) {
  const kept: { id: number; last_inspected_on: string | null; uses_since_inspection: number }[] = await t.deps
    .db('kit_items')
    .where('firm_id', firmId)
    .orderBy('id')
    .select('id', 'last_inspected_on', 'uses_since_inspection');
  const counted = await Promise.all(
    kept.map(async (item) => {
      const last = await t.deps
        .db('inspections')
        .where({ firm_id: firmId, item_id: item.id })
        .first(t.deps.db.raw('MAX(inspected_on) AS on_day'), t.deps.db.raw('MAX(created_at) AS at'));
      const after = (q: ReturnType<typeof t.deps.db>, column: string) => (last?.at ? q.where(column, '>', last.at) : q);
      const [checkIns] = (await after(
        t.deps.db('custody_events').where({ firm_id: firmId, item_id: item.id, action: 'check_in' }),
        'created_at',
      ).count({ n: '*' })) as { n: number | string }[];
      const [jobUses] = (await after(
        t.deps.db('kit_item_uses').where({ firm_id: firmId, item_id: item.id }),
        'used_at',
      ).count({ n: '*' })) as { n: number | string }[];
      return {
        id: item.id,
        last_inspected_on: (last?.on_day as string | null) ?? null,
        uses_since_inspection: Number(checkIns!.n) + Number(jobUses!.n),
      };
    }),
  );
  return { kept, counted };
}

describe('kit items keep their inspection state', () => {
  it('agrees with the records after check-ins, an inspection and direct writes, and the list shows it', async () => {
    const firm = await seedFirm(t.deps.db, 'item-state');
    const stores = await signIn(t.app, firm.people.stores.email);
    let state = await keptAndCounted(firm.firmId);
    expect(state.kept).toEqual(state.counted);

    // Two round trips of the kit: two check-ins of each of its items.
    for (let n = 0; n < 2; n += 1) {
      expect((await stores.post(`/api/kits/${firm.kit.id}/check-out`, { toLocationId: firm.van.id })).status).toBe(200);
      expect((await stores.post(`/api/kits/${firm.kit.id}/check-in`, { condition: 'in_service' })).status).toBe(200);
    }
    state = await keptAndCounted(firm.firmId);
    expect(state.kept).toEqual(state.counted);
    const inKit = firm.kit.itemIds[0]!;
    const usesBefore = state.kept.find((i) => i.id === inKit)!.uses_since_inspection;
    expect(usesBefore).toBeGreaterThanOrEqual(2);

    // An inspection starts the count again.
    const inspected = await stores.post(`/api/kit-items/${inKit}/inspections`, { result: 'passed' });
    expect(inspected.status).toBe(201);
    state = await keptAndCounted(firm.firmId);
    expect(state.kept).toEqual(state.counted);
    expect(state.kept.find((i) => i.id === inKit)!.uses_since_inspection).toBe(0);

    // Written straight to the records (as a seed or a fixture does): the item follows all the same.
    await t.deps.db('inspections').where({ firm_id: firm.firmId, item_id: inKit }).del();
    state = await keptAndCounted(firm.firmId);
    expect(state.kept).toEqual(state.counted);
    expect(state.kept.find((i) => i.id === inKit)!.uses_since_inspection).toBeGreaterThanOrEqual(usesBefore);

    const listed = await stores.get(`/api/kit-items?kitId=${firm.kit.id}&pageSize=200`).expect(200);
    for (const item of listed.body.items as { id: number; inspection: { usesSinceInspection: number } }[])
      expect(item.inspection.usesSinceInspection).toBe(
        state.counted.find((c) => c.id === item.id)!.uses_since_inspection,
      );
  });

  it('pages the item list in SQL by asset tag, a page at a time, with the total', async () => {
    const firm = await seedFirm(t.deps.db, 'item-pages');
    const stores = await signIn(t.app, firm.people.stores.email);
    const all = await stores.get('/api/kit-items?pageSize=200').expect(200);
    const tags = (all.body.items as { assetTag: string }[]).map((i) => i.assetTag);
    expect(all.body.total).toBe(tags.length);
    expect(tags.length).toBeGreaterThanOrEqual(2);
    const paged: string[] = [];
    for (let page = 1; page <= tags.length; page += 1) {
      const one = await stores.get(`/api/kit-items?pageSize=1&page=${page}`).expect(200);
      expect(one.body.total).toBe(tags.length);
      paged.push(...(one.body.items as { assetTag: string }[]).map((i) => i.assetTag));
    }
    expect(paged).toEqual(tags);
    const backwards = await stores.get('/api/kit-items?pageSize=200&dir=desc').expect(200);
    expect((backwards.body.items as { assetTag: string }[]).map((i) => i.assetTag)).toEqual([...tags].reverse());
  });
});
