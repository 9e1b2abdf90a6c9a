import { describe, expect, it } from 'vitest';
import { allocateFefo, isExpired, usableQuantity, type BatchStock } from './fefo.ts';
import { planReorder, planRestock } from './restock.ts';
import { formatPackSize, imperialGallonsToLitres, litresToImperialGallons, packSizeMl } from './units.ts';

const today = '2026-12-01';
const batch = (batchId: number, expiresOn: string, quantity: number, lotNumber = `L${batchId}`): BatchStock => ({
  batchId,
  lotNumber,
  expiresOn,
  quantity,
});

describe('units', () => {
  // Weights and Measures Act 1985, Schedule 1: 1 gallon = 4.54609 litres exactly.
  it('converts litres and imperial gallons by the legal definition', () => {
    expect(imperialGallonsToLitres(1)).toBe(4.54609);
    expect(litresToImperialGallons(4.54609)).toBe(1);
    expect(litresToImperialGallons(100)).toBeCloseTo(21.9969, 4);
  });
  it('keeps pack sizes in millilitres', () => {
    expect(packSizeMl(0.5, 'l')).toBe(500);
    expect(packSizeMl(500, 'ml')).toBe(500);
    expect(formatPackSize(1000)).toBe('1 L');
    expect(formatPackSize(500)).toBe('500 ml');
  });
});

// First expiry, first out, as DEVELOPERS.md, Product rules, sets out; the cases are worked by hand.
describe('allocateFefo', () => {
  const stock = [
    batch(1, '2027-06-30', 4),
    batch(2, '2027-01-31', 2),
    batch(3, '2026-11-30', 9),
    batch(4, '2027-01-31', 3, 'A0'),
  ];
  it.each([
    ['takes the soonest usable expiry first; an expired batch never', 1, [{ batchId: 4, quantity: 1 }], 0],
    [
      'ties on expiry go by lot number',
      4,
      [
        { batchId: 4, quantity: 3 },
        { batchId: 2, quantity: 1 },
      ],
      0,
    ],
    [
      'spills into the next batch',
      7,
      [
        { batchId: 4, quantity: 3 },
        { batchId: 2, quantity: 2 },
        { batchId: 1, quantity: 2 },
      ],
      0,
    ],
    [
      'reports what it cannot find',
      12,
      [
        { batchId: 4, quantity: 3 },
        { batchId: 2, quantity: 2 },
        { batchId: 1, quantity: 4 },
      ],
      3,
    ],
    ['nothing wanted, nothing taken', 0, [], 0],
  ] as const)('%s', (_name, wanted, expected, shortfall) => {
    const out = allocateFefo(stock, wanted, today);
    expect(out.allocations.map(({ batchId, quantity }) => ({ batchId, quantity }))).toEqual(expected);
    expect(out.shortfall).toBe(shortfall);
  });
  it('a batch is usable on its expiry day and expired the day after', () => {
    expect(isExpired(batch(1, today, 1), today)).toBe(false);
    expect(isExpired(batch(1, '2026-11-30', 1), today)).toBe(true);
    expect(usableQuantity(stock, today)).toBe(9);
  });
});

describe('planRestock and planReorder', () => {
  const par = { minimum: 2, target: 4 };
  it.each([
    ['a van at target gets nothing', [{ locationId: 10, productId: 1, usable: 4, par }], [6], []],
    [
      'a van below target is brought to target',
      [{ locationId: 10, productId: 1, usable: 1, par }],
      [6],
      [{ locationId: 10, wanted: 3, got: 3, shortfall: 0 }],
    ],
    [
      'scarce stock goes to the van below its minimum first',
      [
        { locationId: 10, productId: 1, usable: 3, par },
        { locationId: 11, productId: 1, usable: 0, par },
      ],
      [3],
      [
        { locationId: 11, wanted: 4, got: 3, shortfall: 1 },
        { locationId: 10, wanted: 1, got: 0, shortfall: 1 },
      ],
    ],
  ] as const)('%s', (_name, vans, depotQty, expected) => {
    const depot = new Map([[1, [batch(1, '2027-06-30', depotQty[0]!)]]]);
    const lines = planRestock([...vans], depot, today);
    expect(
      lines.map((l) => ({
        locationId: l.locationId,
        wanted: l.wanted,
        got: l.allocations.reduce((n, a) => n + a.quantity, 0),
        shortfall: l.shortfall,
      })),
    ).toEqual(expected);
  });

  it('allocates the restock from the depot FEFO and skips expired depot stock', () => {
    const depot = new Map([[1, [batch(1, '2027-06-30', 5), batch(2, '2027-02-28', 1), batch(3, '2026-10-01', 10)]]]);
    const [line] = planRestock([{ locationId: 10, productId: 1, usable: 0, par }], depot, today);
    expect(line!.allocations.map((a) => [a.batchId, a.quantity])).toEqual([
      [2, 1],
      [1, 3],
    ]);
  });

  it('reorders what the depot lacks after the run, with days of cover from 90 days of use', () => {
    const depotBatches = [batch(1, '2027-06-30', 5)];
    const restock = planRestock(
      [{ locationId: 10, productId: 1, usable: 0, par }],
      new Map([[1, depotBatches]]),
      today,
    );
    // After sending 4 the depot has 1, under its minimum of 3: order 10 - 1 = 9. 45 used in 90 days is
    // 0.5 a day, so 1 pack lasts 2 days.
    const [line] = planReorder(
      [{ productId: 1, depotBatches, par: { minimum: 3, target: 10 }, used90Days: 45 }],
      restock,
      today,
    );
    expect(line).toMatchObject({ usableAfterTransfers: 1, orderQuantity: 9, daysOfCover: 2 });
    expect(
      planReorder(
        [{ productId: 1, depotBatches: [batch(1, '2027-06-30', 20)], par: { minimum: 3, target: 10 }, used90Days: 0 }],
        [],
        today,
      ),
    ).toEqual([]);
  });
});
