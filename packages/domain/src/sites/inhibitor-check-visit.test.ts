import { describe, expect, it } from 'vitest';
import { inhibitorCheckVisitInputSchema, inhibitorVisitOutcome } from './inhibitor-check-visit.ts';

// The target range is the product's own (an invented 100 to 300 ppm here); the intervals are DEVELOPERS.md,
// Product rules: a year after a passed visit, a month after one that still fails (common practice (no source)).
const range = { min: 100, max: 300 };

describe('inhibitorVisitOutcome', () => {
  it('a reading inside the range passes and sets the next check 12 calendar months on', () => {
    expect(inhibitorVisitOutcome('2026-12-03', range, 180, null)).toEqual({
      firstResult: 'pass',
      retestResult: null,
      result: 'pass',
      nextCheckOn: '2027-12-03',
    });
  });
  it('a failed reading with no re-test fails the visit and brings the next check to a month on', () => {
    expect(inhibitorVisitOutcome('2026-12-03', range, 60, undefined)).toMatchObject({
      result: 'fail',
      nextCheckOn: '2027-01-03',
    });
  });
  it('a failed reading topped up and re-tested inside the range passes the visit: a year on', () => {
    expect(inhibitorVisitOutcome('2026-12-03', range, 60, 150)).toEqual({
      firstResult: 'fail',
      retestResult: 'pass',
      result: 'pass',
      nextCheckOn: '2027-12-03',
    });
  });
  it('a re-test still out of range fails: a month on (31 January to 28 February)', () => {
    expect(inhibitorVisitOutcome('2027-01-31', range, 60, 90)).toMatchObject({
      retestResult: 'fail',
      result: 'fail',
      nextCheckOn: '2027-02-28',
    });
  });
  it('the range is inclusive at both ends; over the top fails', () => {
    expect(inhibitorVisitOutcome('2026-12-03', range, 100, null).result).toBe('pass');
    expect(inhibitorVisitOutcome('2026-12-03', range, 300, null).result).toBe('pass');
    expect(inhibitorVisitOutcome('2026-12-03', range, 300.1, null).result).toBe('fail');
  });
});

describe('inhibitorCheckVisitInputSchema', () => {
  it('speaks the user’s words for a missing reading and a top-up of no packs', () => {
    const r = inhibitorCheckVisitInputSchema.safeParse({
      checkedOn: '2026-12-01',
      inhibitorProductId: 3,
      topUp: { vanId: 2, packs: 0 },
    });
    expect(r.error?.issues.map((i) => i.message)).toEqual([
      'The inhibitor reading must be a number.',
      'Top up at least 1 pack.',
    ]);
  });
  it('e-mails the customer unless told not to', () => {
    const r = inhibitorCheckVisitInputSchema.parse({
      checkedOn: '2026-12-01',
      inhibitorProductId: 3,
      inhibitorReading: 150,
    });
    expect(r.emailCustomer).toBe(true);
  });
});
