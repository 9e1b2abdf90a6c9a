import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { formatPence, mulDivRoundHalfUp, parsePounds, vatOn } from './pence.ts';
import { priceLines } from './vat-lines.ts';

describe('pence', () => {
  it('formats and parses pounds exactly (no floating point on the way)', () => {
    expect(formatPence(123456)).toBe('£1,234.56');
    expect(formatPence(5)).toBe('£0.05');
    expect(formatPence(-250)).toBe('-£2.50');
    expect(parsePounds('12')).toBe(1200);
    expect(parsePounds('12.5')).toBe(1250);
    expect(parsePounds('£1,234.56')).toBe(123456);
    // 0.1 + 0.2 is not 0.3 in floating point; in pence it is.
    expect(parsePounds('0.10')! + parsePounds('0.20')!).toBe(parsePounds('0.30'));
    expect(parsePounds('12.345')).toBeNull();
    expect(parsePounds('-3')).toBeNull();
    expect(parsePounds('abc')).toBeNull();
  });

  it('parse and format are inverses for every amount (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 1_000_000_000 }), (p) => {
        expect(parsePounds(formatPence(p))).toBe(p);
      }),
    );
  });

  it('rounds half away from zero in integers, matching exact rational arithmetic (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 100_000_000 }), fc.integer({ min: 0, max: 10_000 }), (net, bp) => {
        const r = mulDivRoundHalfUp(net, bp, 10_000);
        // r is the nearest integer: |net*bp - r*10000| <= 5000, and exactly 5000 only when rounded up.
        const diff = net * bp - r * 10_000;
        expect(Math.abs(diff)).toBeLessThanOrEqual(5000);
        if (Math.abs(diff) === 5000) expect(diff).toBe(-5000);
      }),
    );
  });
});

// Worked examples of the rule in vat-lines.ts: VAT per line to the nearest penny, 0.5p or more rounded up
// (HMRC VAT Notice 700 paragraph 17.5; HMRC manual VATREC12030 for the half penny).
describe('VAT per line, nearest penny', () => {
  it('20% of £10.00 is £2.00; of £12.34 is £2.468 -> £2.47; of £12.37 is £2.474 -> £2.47', () => {
    expect(vatOn(1000, 2000)).toBe(200);
    expect(vatOn(1234, 2000)).toBe(247);
    expect(vatOn(1237, 2000)).toBe(247);
    expect(vatOn(1238, 2000)).toBe(248);
  });

  it('an exact half penny rounds up (VATREC12030): 5% of 10p is 0.5p -> 1p; 17.5% of 20p is 3.5p -> 4p', () => {
    expect(vatOn(10, 500)).toBe(1);
    expect(vatOn(30, 500)).toBe(2);
    expect(vatOn(20, 1750)).toBe(4);
    expect(vatOn(2, 1750)).toBe(0); // 0.35p rounds down
  });

  it('the total VAT is the sum of the lines, not VAT on the total: three 2p lines at 20% carry no VAT', () => {
    // Each line: 2p x 20% = 0.4p -> 0p; on the invoice total it would have been 6p x 20% = 1.2p -> 1p.
    const { totals } = priceLines(
      [1, 2, 3].map((i) => ({ description: `Washer ${i}`, quantity: 1, unitPence: 2, vatRateBp: 2000 })),
      true,
    );
    expect(totals).toEqual({ netPence: 6, vatPence: 0, totalPence: 6 });
  });

  it('a visit, two packs of cleaner and a filter: net £379.98, VAT £76.00, total £455.98', () => {
    const { lines, totals } = priceLines(
      [
        { description: 'Full clean, 9 radiators', quantity: 1, unitPence: 27_500, vatRateBp: 2000 },
        { description: 'Cleaner, 1 L', quantity: 2, unitPence: 2_999, vatRateBp: 2000 },
        { description: 'Filter fitted', quantity: 1, unitPence: 4_500, vatRateBp: 2000 },
      ],
      true,
    );
    // 2 x £29.99 = £59.98; 20% = £11.996 -> £12.00
    expect(lines.map((l) => [l.netPence, l.vatPence])).toEqual([
      [27_500, 5_500],
      [5_998, 1_200],
      [4_500, 900],
    ]);
    expect(totals).toEqual({ netPence: 37_998, vatPence: 7_600, totalPence: 45_598 });
  });

  it('a firm not registered for VAT charges none, whatever rate a line carries', () => {
    const { lines, totals } = priceLines(
      [{ description: 'Inhibitor visit', quantity: 1, unitPence: 9_000, vatRateBp: 2000 }],
      false,
    );
    expect(lines[0]).toMatchObject({ vatRateBp: 0, vatPence: 0 });
    expect(totals).toEqual({ netPence: 9_000, vatPence: 0, totalPence: 9_000 });
  });

  it('lines always add up: total = net + VAT, VAT = sum of line VAT (property)', () => {
    const line = fc.record({
      description: fc.constant('x'),
      quantity: fc.integer({ min: 1, max: 100 }),
      unitPence: fc.integer({ min: 0, max: 1_000_000 }),
      vatRateBp: fc.constantFrom(0, 500, 2000),
    });
    fc.assert(
      fc.property(fc.array(line, { maxLength: 20 }), (ls) => {
        const { lines, totals } = priceLines(ls, true);
        expect(totals.totalPence).toBe(totals.netPence + totals.vatPence);
        expect(totals.vatPence).toBe(lines.reduce((s, l) => s + l.vatPence, 0));
        for (const l of lines) expect(Number.isInteger(l.vatPence)).toBe(true);
      }),
    );
  });
});
