import { describe, expect, it } from 'vitest';
import { formatPackSize, packSizeInUnit, packSizeMl } from './units.ts';

// common practice (no source): a pack is kept in whole millilitres and written in litres from 1 L up.
describe('packSizeInUnit', () => {
  it('writes a pack of whole tenths of a litre from 1 L up in litres', () => {
    expect(packSizeInUnit(1000)).toEqual({ size: 1, unit: 'l' });
    expect(packSizeInUnit(2500)).toEqual({ size: 2.5, unit: 'l' });
    expect(formatPackSize(2500)).toBe('2.5 L');
  });

  it('writes anything else in millilitres', () => {
    expect(packSizeInUnit(500)).toEqual({ size: 500, unit: 'ml' });
    expect(packSizeInUnit(1250)).toEqual({ size: 1250, unit: 'ml' });
    expect(formatPackSize(1250)).toBe('1250 ml');
  });

  it('round-trips through packSizeMl, so a form shows what is stored', () => {
    for (const ml of [1, 250, 500, 999, 1000, 1250, 2500, 20_000, 25_000]) {
      const { size, unit } = packSizeInUnit(ml);
      expect(packSizeMl(size, unit)).toBe(ml);
    }
  });
});
