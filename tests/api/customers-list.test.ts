import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, signIn, type TestApp } from './support/test-app.ts';
import { seedFirm } from './support/seed-firm.ts';

// Issue 14: the customers list is searched and paged by the server (159 customers were one 19,600 px page).

let t: TestApp;
beforeAll(() => {
  t = createTestApp();
});
afterAll(() => t.close());

type Row = {
  id: number;
  name: string;
  sites: { address: string; postcode: string | null; nextCheckOn: string | null }[];
};

describe('the customers list, paged and searched by the server', () => {
  it('answers one page at a time with the total, every customer once across the pages, in name order', async () => {
    const firm = await seedFirm(t.deps.db, 'cust-pages');
    const office = await signIn(t.app, firm.people.admin.email);
    for (let i = 0; i < 57; i += 1)
      expect((await office.post('/api/customers', { name: `Bramwell ${String(i).padStart(2, '0')}` })).status).toBe(
        201,
      );
    const before = (await office.get('/api/customers?pageSize=1').expect(200)).body.total as number;
    expect(before).toBeGreaterThanOrEqual(57);

    const first = (await office.get('/api/customers').expect(200)).body;
    expect(first.page).toBe(1);
    expect(first.pageSize).toBe(25);
    expect(first.total).toBe(before);
    expect(first.customers).toHaveLength(25);

    const seen: string[] = [];
    for (let page = 1; page <= Math.ceil(before / 20); page += 1) {
      const body = (await office.get(`/api/customers?page=${page}&pageSize=20`).expect(200)).body;
      expect(body.total).toBe(before);
      seen.push(...(body.customers as Row[]).map((c) => c.name));
    }
    expect(seen).toHaveLength(before);
    expect(new Set(seen).size).toBe(before);
    expect(seen).toEqual([...seen].sort((a, b) => a.localeCompare(b, 'en', { sensitivity: 'base' })));
    // Past the last page: an empty page, still with the total.
    const beyond = (await office.get('/api/customers?page=99&pageSize=20').expect(200)).body;
    expect(beyond.customers).toEqual([]);
    expect(beyond.total).toBe(before);
  });

  it('searches by name, address or postcode, with the matching total, and pages the matches', async () => {
    const firm = await seedFirm(t.deps.db, 'cust-search');
    const office = await signIn(t.app, firm.people.admin.email);
    for (let i = 0; i < 30; i += 1)
      expect((await office.post('/api/customers', { name: `Ferncastle ${String(i).padStart(2, '0')}` })).status).toBe(
        201,
      );
    const withSite = await office.post('/api/customers', { name: 'Oona Ridgeway' });
    await office.post(`/api/customers/${withSite.body.customer.id}/sites`, {
      address: '12 Kiln Lane, Marshby',
      postcode: 'MB3 7XY',
    });

    const page2 = (await office.get('/api/customers?q=ferncastle&page=2&pageSize=25').expect(200)).body;
    expect(page2.total).toBe(30);
    expect((page2.customers as Row[]).map((c) => c.name)).toEqual([
      'Ferncastle 25',
      'Ferncastle 26',
      'Ferncastle 27',
      'Ferncastle 28',
      'Ferncastle 29',
    ]);
    const byPostcode = (await office.get('/api/customers?q=mb37x&pageSize=25').expect(200)).body;
    expect(byPostcode.total).toBe(1);
    expect(byPostcode.customers[0]).toMatchObject({
      name: 'Oona Ridgeway',
      sites: [{ address: '12 Kiln Lane, Marshby', postcode: 'MB3 7XY', nextCheckOn: null }],
    });
    expect((await office.get('/api/customers?q=kiln%20lane').expect(200)).body.total).toBe(1);
    // Without a page size a search stays the booking's type-ahead: its best 10.
    const typeAhead = (await office.get('/api/customers?q=Ferncastle').expect(200)).body;
    expect(typeAhead.customers).toHaveLength(10);
    expect(typeAhead.total).toBe(30);
  });

  it('refuses a bad page in the user\u2019s words and never shows another firm\u2019s customers', async () => {
    const firm = await seedFirm(t.deps.db, 'cust-bad');
    const office = await signIn(t.app, firm.people.admin.email);
    await office.post('/api/customers', { name: 'Quentin Harrowby' });
    const bad = await office.get('/api/customers?page=0');
    expect(bad.status).toBe(422);
    expect(JSON.stringify(bad.body)).toContain('Pages start at 1.');
    const big = await office.get('/api/customers?pageSize=500');
    expect(big.status).toBe(422);
    expect(JSON.stringify(big.body)).toContain('The page size must be at most 100.');
    const word = await office.get('/api/customers?page=two');
    expect(word.status).toBe(422);
    expect(JSON.stringify(word.body)).toContain('The page must be a whole number.');

    const other = await seedFirm(t.deps.db, 'cust-bad-other');
    const stranger = await signIn(t.app, other.people.admin.email);
    const theirs = (await stranger.get('/api/customers?q=Harrowby&pageSize=50').expect(200)).body;
    expect(theirs).toMatchObject({ customers: [], total: 0 });
  });
});
