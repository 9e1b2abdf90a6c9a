import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, signIn, type TestApp } from './support/test-app.ts';
import { seedFirm } from './support/seed-firm.ts';

// The stock grid is paged by place (issue 16): a page holds its places' cells only, every place is named
// on every page (the stock forms choose from them), and each product's totals cover every page.

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

interface GridPage {
  locations: { id: number; kind: string }[];
  places: { id: number; kind: string; name: string }[];
  page: { page: number; limit: number; placeCount: number; pageCount: number };
  cells: { locationId: number; productId: number; usable: number; expired: number; booked: number }[];
  totals: { productId: number; usable: number; expired: number; booked: number }[];
}

describe('stock grid paged by place', () => {
  it('pages the places one at a time, each page with its own cells, totals over all of them', async () => {
    const firm = await seedFirm(t.deps.db, 'grid-pages');
    const other = await seedFirm(t.deps.db, 'grid-other');
    const stores = await signIn(t.app, firm.people.stores.email);

    const pages: GridPage[] = [];
    for (let page = 1; ; page += 1) {
      const res = await stores.get(`/api/stock?page=${page}&limit=1`);
      expect(res.status).toBe(200);
      pages.push(res.body as GridPage);
      if (page >= (res.body as GridPage).page.pageCount) break;
    }
    // The seeded firm has its depot, its van and a spare van: three places, three pages of one.
    expect(pages.map((p) => p.page)).toEqual(
      [1, 2, 3].map((page) => ({ page, limit: 1, placeCount: 3, pageCount: 3 })),
    );
    const places = pages[0]!.places;
    expect(places[0]!.kind).toBe('depot');
    expect(pages.flatMap((p) => p.locations.map((l) => l.id))).toEqual(places.map((p) => p.id));
    expect(places.map((p) => p.id)).toEqual(expect.arrayContaining([firm.depotId, firm.van.id, firm.spareVanId]));
    expect(places.map((p) => p.id)).not.toContain(other.depotId);
    for (const p of pages) {
      expect(p.places).toEqual(places);
      const ids = p.locations.map((l) => l.id);
      for (const cell of p.cells) expect(ids).toContain(cell.locationId);
    }

    // The seed holds 10 packs at the depot and 2 on the van, all in date: 12 over every place.
    const cells = pages.flatMap((p) => p.cells).filter((c) => c.productId === firm.product.id);
    expect(cells.find((c) => c.locationId === firm.depotId)).toMatchObject({ usable: 10, expired: 0 });
    expect(cells.find((c) => c.locationId === firm.van.id)).toMatchObject({ usable: 2, expired: 0 });
    const total = pages[0]!.totals.find((x) => x.productId === firm.product.id);
    expect(total).toEqual({ productId: firm.product.id, usable: 12, expired: 0, booked: expect.any(Number) });
    expect(total!.usable).toBe(cells.reduce((n, c) => n + c.usable, 0));
    expect(total!.booked).toBe(cells.reduce((n, c) => n + c.booked, 0));
    for (const p of pages) expect(p.totals).toEqual(pages[0]!.totals);
  });

  it('answers the first page of 20 places unasked, an empty page past the end, and 422 for a bad page', async () => {
    const firm = await seedFirm(t.deps.db, 'grid-bounds');
    const stores = await signIn(t.app, firm.people.stores.email);
    const first = (await stores.get('/api/stock')).body as GridPage;
    expect(first.page).toEqual({ page: 1, limit: 20, placeCount: 3, pageCount: 1 });
    expect(first.locations.map((l) => l.id)).toEqual(first.places.map((p) => p.id));

    const past = (await stores.get('/api/stock?page=5')).body as GridPage;
    expect(past.locations).toEqual([]);
    expect(past.cells).toEqual([]);
    expect(past.totals).toEqual(first.totals);

    const zero = await stores.get('/api/stock?page=0');
    expect(zero.status).toBe(422);
    expect(zero.body.message).toMatch(/Page must be a whole number from 1/);
    const many = await stores.get('/api/stock?limit=101');
    expect(many.status).toBe(422);
    expect(many.body.message).toMatch(/Places per page must be a whole number from 1 to 100/);
  });
});
