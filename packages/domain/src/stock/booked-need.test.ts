import { describe, expect, it } from 'vitest';
import { bookedJobShortfalls, bookedPacksByVan, jobsWithin, vanProductKey, type BookedJob } from './booked-need.ts';
import { isLargeStocktakeChange, lotLifeAtReceipt, zeroesWholePlace } from './receiving.ts';
import { planRestock } from './restock.ts';
import { simulateRestock } from './restock-simulation.ts';
import { placeHealthOf, stockHealthOf, stockNeedOf } from './stock-health.ts';
import { formatPacks, penceToPounds } from './units.ts';

// Hand-worked cases of the rules: a van's need = max(par target, booked packs + minimum)
// (the product rule this issue sets; common practice (no source)), and the minimum remaining life at
// receiving (90 days by default: common practice (no source)).

const today = '2026-12-01';
const par = { minimum: 1, target: 3 };

describe('stock need and health', () => {
  it('raises the target to cover the booked jobs and keep the minimum', () => {
    expect(stockNeedOf(par, 0)).toEqual({ minimum: 1, target: 3 });
    expect(stockNeedOf(par, 1)).toEqual({ minimum: 1, target: 3 }); // 1 + 1 < 3: par stands
    expect(stockNeedOf(par, 4)).toEqual({ minimum: 1, target: 5 });
    expect(stockNeedOf(null, 2)).toEqual({ minimum: 0, target: 2 });
    expect(stockNeedOf(null, 0)).toBeNull();
  });
  it.each([
    [0, par, 0, 'empty'],
    [2, par, 4, 'short_for_jobs'],
    [0, { minimum: 2, target: 4 }, 0, 'empty'],
    [1, { minimum: 2, target: 4 }, 0, 'below_minimum'],
    [4, par, 4, 'below_target'], // 4 covers the jobs but not the minimum after them (target 5)
    [3, par, 0, 'ok'],
    [5, null, 0, 'no_par'],
  ] as const)('%i usable against %o with %i booked is %s', (usable, p, booked, expected) => {
    expect(stockHealthOf(usable, p, booked)).toBe(expected);
  });
  it('judges a place by its worst product, never by packs added across products', () => {
    // 3 of cleaner (ok) and 1 of inhibitor (below target 3): the van is below target, not "4 packs, fine".
    const place = placeHealthOf([stockHealthOf(3, par), stockHealthOf(1, par), 'no_par']);
    expect(place.health).toBe('below_target');
    expect(place.counts).toMatchObject({ ok: 1, below_target: 1, no_par: 1 });
    expect(placeHealthOf(['no_par']).health).toBe('no_par');
  });
});

describe('receiving and stocktake safeguards', () => {
  it('refuses an expired lot and asks about one with less than the minimum life', () => {
    expect(lotLifeAtReceipt('2026-11-30', today, 90)).toEqual({ state: 'expired' });
    expect(lotLifeAtReceipt(today, today, 90)).toEqual({ state: 'short', daysLeft: 0 });
    // 1 Dec to 1 Mar 2027 is 31 (Dec) + 31 (Jan) + 28 (Feb) = 90 days; to 28 Feb, 89.
    expect(lotLifeAtReceipt('2027-02-28', today, 90)).toEqual({ state: 'short', daysLeft: 89 });
    expect(lotLifeAtReceipt('2027-03-01', today, 90)).toEqual({ state: 'ok', daysLeft: 90 });
  });
  it('calls a count large when it zeroes a batch or moves it by 5 or more and half', () => {
    expect(isLargeStocktakeChange(3, 0)).toBe(true);
    expect(isLargeStocktakeChange(10, 6)).toBe(false);
    expect(isLargeStocktakeChange(10, 4)).toBe(true); // 6 off: at least 5, and at least half of 10
    expect(isLargeStocktakeChange(2, 6)).toBe(false); // 4 off: under 5
  });
  it('spots a count that empties a whole place', () => {
    const held = [
      { batchId: 1, quantity: 2 },
      { batchId: 2, quantity: 0 },
    ];
    expect(zeroesWholePlace(held, new Map([[1, 0]]))).toBe(true);
    expect(zeroesWholePlace(held, new Map([[1, 1]]))).toBe(false);
    expect(zeroesWholePlace([], new Map())).toBe(false);
  });
  it('writes packs with their size and pence as pounds', () => {
    expect(formatPacks(3, 1000)).toBe('3 packs of 1 L');
    expect(formatPacks(1, 500)).toBe('1 pack of 500 ml');
    expect(penceToPounds(1250)).toBe('12.50');
    expect(penceToPounds(7)).toBe('0.07');
  });
});

const job = (jobId: number, vanId: number, scheduledOn: string, packs: number, productId = 1): BookedJob => ({
  jobId,
  vanId,
  scheduledOn,
  packs: [{ productId, packs }],
});

describe('booked jobs', () => {
  const jobs = [job(1, 10, '2026-12-01', 2), job(2, 10, '2026-12-03', 2), job(3, 10, '2026-12-08', 5)];
  it('counts the jobs of the next N days, today included', () => {
    expect(jobsWithin(jobs, today, 7).map((j) => j.jobId)).toEqual([1, 2]);
    expect(bookedPacksByVan(jobsWithin(jobs, today, 7)).get(vanProductKey(10, 1))).toBe(4);
  });
  it('finds the later job short when earlier ones use up the van', () => {
    const short = bookedJobShortfalls(jobs, new Map([[vanProductKey(10, 1), 3]]));
    expect(short.map((s) => [s.jobId, s.short[0]!.shortBy])).toEqual([
      [2, 1],
      [3, 5],
    ]);
  });
  it('restocks a van to its booked packs plus its minimum', () => {
    const depot = new Map([[1, [{ batchId: 1, lotNumber: 'A', expiresOn: '2027-12-31', quantity: 20 }]]]);
    const [line] = planRestock([{ locationId: 10, productId: 1, usable: 2, par, booked: 4 }], depot, today);
    expect(line).toMatchObject({ need: { minimum: 1, target: 5 }, wanted: 3, booked: 4, shortfall: 0 });
  });
});

describe('simulateRestock', () => {
  // Two vans, par 1/3, a depot at 12/24, the run on Mondays. Van 10 has a heavy week (2 jobs of 2
  // packs); with par alone it leaves Monday with 3 and the second job starts 1 short.
  const base = {
    from: '2026-11-30', // a Monday
    to: '2026-12-13',
    vanIds: [10, 11],
    vanPar: new Map([
      [vanProductKey(10, 1), par],
      [vanProductKey(11, 1), par],
    ]),
    depotPar: new Map([[1, { minimum: 12, target: 24 }]]),
    restockWeekday: 1,
    restockDays: 7,
    deliveryLeadDays: 2,
    jobs: [job(1, 10, '2026-12-01', 2), job(2, 10, '2026-12-02', 2), job(3, 11, '2026-12-09', 1)],
  };
  it('par levels alone start the heavy week short; booked-job restock does not', () => {
    const parOnly = simulateRestock({ ...base, policy: 'par' });
    const booked = simulateRestock({ ...base, policy: 'booked' });
    expect(parOnly).toMatchObject({ jobs: 3, shortStarts: 1, shortJobIds: [2] });
    expect(booked).toMatchObject({ jobs: 3, shortStarts: 0 });
    // Van 10 was filled from 3 to 5 (booked 4 + minimum 1) on the first Monday.
    expect(booked.packsMoved).toBeGreaterThan(parOnly.packsMoved);
  });
});
