import { describe, expect, it } from 'vitest';
import { withThousands } from './thousands.ts';

// The reference is the Unicode CLDR's en-GB decimal format (#,##0.###), as ICU applies it through
// Intl.NumberFormat('en-GB') in Node.
describe('whole numbers with thousands separators', () => {
  it('agrees with the en-GB number format for every size of number', () => {
    const values = [0, 7, 99, 999, 1_000, 2_500, 4_000, 12_345, 999_999, 1_000_000, 1_234_567, 2 ** 53 - 1];
    for (const n of values) {
      expect(withThousands(n)).toBe(n.toLocaleString('en-GB'));
      expect(withThousands(-n || 0)).toBe((-n || 0).toLocaleString('en-GB'));
    }
  });

  it('refuses a fraction rather than round it', () => {
    expect(() => withThousands(1.5)).toThrow(RangeError);
  });
});
