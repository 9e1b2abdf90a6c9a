import { describe, expect, it } from 'vitest';
import { isFirmReadOnly, monthlyChargePence, readOnlyFrom } from './grace-period.ts';

// README, Payments (a product rule, common practice (no source)): 14 days' grace from the first failed payment.
describe('the subscription grace period', () => {
  const failed = new Date('2026-12-01T10:00:00Z');
  it('nothing failed: never read-only', () => {
    expect(readOnlyFrom(null)).toBeNull();
    expect(isFirmReadOnly(null, new Date('2030-01-01T00:00:00Z'))).toBe(false);
  });
  it('turns read-only exactly 14 days after the first failure, not a moment before', () => {
    expect(readOnlyFrom(failed)?.toISOString()).toBe('2026-12-15T10:00:00.000Z');
    expect(isFirmReadOnly(failed, new Date('2026-12-15T09:59:59.999Z'))).toBe(false);
    expect(isFirmReadOnly(failed, new Date('2026-12-15T10:00:00.000Z'))).toBe(true);
  });
  it('charges whole pence per van', () => {
    expect(monthlyChargePence(3, 1_500)).toBe(4_500);
    expect(monthlyChargePence(0, 1_500)).toBe(0);
  });
});
