import { describe, expect, it } from 'vitest';
import { agedBand, amountDue, invoiceStateAfterPayments } from './invoice-state.ts';
import { visitPriceFor } from './price-list.ts';

const inv = (paidPence: number, creditedPence = 0, issued = true) => ({
  issued,
  totalPence: 12_000,
  paidPence,
  creditedPence,
});

describe('invoiceStateAfterPayments (common practice (no source): the states of issue 15)', () => {
  it('follows the money', () => {
    expect(invoiceStateAfterPayments(inv(0, 0, false))).toBe('draft');
    expect(invoiceStateAfterPayments(inv(0))).toBe('issued');
    expect(invoiceStateAfterPayments(inv(5_000))).toBe('part_paid');
    expect(invoiceStateAfterPayments(inv(12_000))).toBe('paid');
    expect(invoiceStateAfterPayments(inv(0, 12_000))).toBe('credited');
    // Credited in part, the rest paid: paid.
    expect(invoiceStateAfterPayments(inv(7_000, 5_000))).toBe('paid');
    // A full refund after paying: issued again (still owed) unless credited.
    expect(invoiceStateAfterPayments(inv(12_000 - 12_000))).toBe('issued');
    expect(invoiceStateAfterPayments(inv(2_000))).toBe('part_paid');
  });

  it('what is due never goes below zero', () => {
    expect(amountDue(inv(5_000))).toBe(7_000);
    expect(amountDue(inv(7_000, 5_000))).toBe(0);
    expect(amountDue(inv(13_000))).toBe(0);
    expect(amountDue(inv(0, 0, false))).toBe(0);
  });

  it('ages debt in bands of 0-30, 31-60 and over 60 days', () => {
    expect(agedBand(0)).toBe('days_0_30');
    expect(agedBand(30)).toBe('days_0_30');
    expect(agedBand(31)).toBe('days_31_60');
    expect(agedBand(60)).toBe('days_31_60');
    expect(agedBand(61)).toBe('days_over_60');
  });
});

describe('visitPriceFor (common practice (no source): base plus a rate, or bands)', () => {
  it('prices by base plus a rate per radiator', () => {
    expect(visitPriceFor({ pricing: 'per_radiator', basePence: 15_000, perRadiatorPence: 1_500, bands: [] }, 8)).toBe(
      27_000,
    );
  });
  it('prices by the first band that covers the count, and beyond the last band by the rate', () => {
    const bands = [
      { upToRadiators: 6, pricePence: 25_000 },
      { upToRadiators: 12, pricePence: 35_000 },
    ];
    const p = { pricing: 'bands' as const, basePence: 0, perRadiatorPence: 2_000, bands };
    expect(visitPriceFor(p, 6)).toBe(25_000);
    expect(visitPriceFor(p, 7)).toBe(35_000);
    expect(visitPriceFor(p, 14)).toBe(39_000);
    expect(visitPriceFor({ ...p, perRadiatorPence: 0 }, 14)).toBeNull();
  });
});
