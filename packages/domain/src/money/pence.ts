import { z } from 'zod';
import { withThousands } from '../lib/thousands.ts';

// Money is whole pence in integers everywhere (columns, schemas, arithmetic); never floating point.
// A VAT rate is whole basis points (2000 = 20%), so a rate is an integer too.

/** The largest amount a single figure may hold: £10,000,000.00 (Number stays exact far beyond it). */
export const MAX_PENCE = 1_000_000_000;

export const penceSchema = (label: string) =>
  z
    .number({ error: `${label} must be an amount in pence.` })
    .int({ error: `${label} must be whole pence.` })
    .min(0, { error: `${label} cannot be negative.` })
    .max(MAX_PENCE, { error: `${label} is more than £10,000,000.` });

/** A VAT rate in basis points: 0 to 100%. */
export const vatRateBpSchema = z
  .number({ error: 'The VAT rate must be a number.' })
  .int({ error: 'The VAT rate is in basis points (2000 = 20%).' })
  .min(0, { error: 'The VAT rate cannot be negative.' })
  .max(10_000, { error: 'The VAT rate cannot be more than 100%.' });

/** The UK standard rate since 4 January 2011 (Value Added Tax Act 1994, section 2, as amended): 20%. */
export const UK_STANDARD_VAT_RATE_BP = 2000;

function assertPence(n: number, what: string): void {
  if (!Number.isSafeInteger(n)) throw new RangeError(`${what} must be whole pence, got ${n}.`);
}

/**
 * a × b / d rounded to the nearest whole number, an exact half rounded away from zero, in integer
 * arithmetic (BigInt, so no product is ever rounded by a float on the way).
 */
export function mulDivRoundHalfUp(a: number, b: number, d: number): number {
  assertPence(a, 'Amount');
  assertPence(b, 'Multiplier');
  if (!Number.isSafeInteger(d) || d <= 0) throw new RangeError('Divisor must be a positive whole number.');
  const p = BigInt(a) * BigInt(b);
  const neg = p < 0n;
  const abs = neg ? -p : p;
  const big = BigInt(d);
  const q = (abs * 2n + big) / (big * 2n);
  return Number(neg ? -q : q);
}

/** The VAT on a net amount at a rate, rounded to the nearest penny, half a penny up (see vat-lines.ts). */
export function vatOn(netPence: number, rateBp: number): number {
  return mulDivRoundHalfUp(netPence, rateBp, 10_000);
}

export function sumPence(values: readonly number[]): number {
  let total = 0;
  for (const v of values) {
    assertPence(v, 'Amount');
    total += v;
  }
  assertPence(total, 'Total');
  return total;
}

/** £1,234.56 (a minus sign before the pound sign for a negative amount). */
export function formatPence(pence: number): string {
  assertPence(pence, 'Amount');
  const abs = Math.abs(pence);
  const pounds = withThousands(Math.floor(abs / 100));
  const p = String(abs % 100).padStart(2, '0');
  return `${pence < 0 ? '-' : ''}£${pounds}.${p}`;
}

/** Pounds as typed ("12", "12.5", "£1,234.56") to pence, exactly (string digits, no float); null if not money. */
export function parsePounds(text: string): number | null {
  const m = /^\s*£?\s*(\d{1,3}(?:,\d{3})+|\d+)(?:\.(\d{1,2}))?\s*$/.exec(text);
  if (!m) return null;
  const pounds = Number(m[1]!.replace(/,/g, ''));
  const pence = Number((m[2] ?? '0').padEnd(2, '0'));
  const total = pounds * 100 + pence;
  return Number.isSafeInteger(total) && total <= MAX_PENCE ? total : null;
}

/** 2000 -> "20%", 1750 -> "17.5%", 0 -> "0%". */
export function formatVatRate(rateBp: number): string {
  return `${(rateBp / 100).toFixed(2).replace(/\.?0+$/, '')}%`;
}
