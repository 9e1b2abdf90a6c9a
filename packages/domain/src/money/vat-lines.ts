import { sumPence, vatOn } from './pence.ts';

/**
 * THE ROUNDING RULE (named once, used by quotes, invoices and credit notes alike): VAT is worked out
 * per line, on the line's net amount (quantity × unit price, exact in pence), and rounded to the
 * nearest penny, half a penny or more rounded up; the VAT total is the sum of the lines' VAT, so every
 * printed line adds up to the printed total. HMRC VAT Notice 700 ("The VAT Guide"), paragraph 17.5,
 * allows VAT calculated at line level rounded to the nearer 1p; HMRC's manual VATREC12030 ("What do
 * we mean by rounding up and down?"): under 0.5p round down, 0.5p or more round up. We do not take
 * paragraph 17.5's concession to round the invoice-level total down.
 * A firm not registered for VAT charges none: every line's rate and VAT are 0 and no VAT is printed.
 */
export const VAT_ROUNDING_RULE =
  'VAT per line, rounded to the nearest penny (half a penny up); the VAT total is the sum of the lines (HMRC VAT Notice 700, paragraph 17.5)';

export interface PricedLineInput {
  description: string;
  quantity: number;
  unitPence: number;
  /** Basis points; ignored (0) when the firm is not VAT registered. */
  vatRateBp: number;
}

export interface PricedLine extends PricedLineInput {
  netPence: number;
  vatPence: number;
  grossPence: number;
}

export interface Totals {
  netPence: number;
  vatPence: number;
  totalPence: number;
}

export function priceLine(line: PricedLineInput, vatRegistered: boolean): PricedLine {
  if (!Number.isSafeInteger(line.quantity) || line.quantity < 0) throw new RangeError('Quantity must be whole.');
  const netPence = line.quantity * line.unitPence;
  if (!Number.isSafeInteger(netPence)) throw new RangeError('Line amount is too large.');
  const vatRateBp = vatRegistered ? line.vatRateBp : 0;
  const vatPence = vatOn(netPence, vatRateBp);
  return { ...line, vatRateBp, netPence, vatPence, grossPence: netPence + vatPence };
}

export function priceLines(
  lines: readonly PricedLineInput[],
  vatRegistered: boolean,
): { lines: PricedLine[]; totals: Totals } {
  const priced = lines.map((l) => priceLine(l, vatRegistered));
  const netPence = sumPence(priced.map((l) => l.netPence));
  const vatPence = sumPence(priced.map((l) => l.vatPence));
  return { lines: priced, totals: { netPence, vatPence, totalPence: netPence + vatPence } };
}

/** VAT totals by rate, for the invoice's summary (regulation 14 asks for the rate and the VAT payable). */
export function vatByRate(
  lines: readonly Pick<PricedLine, 'vatRateBp' | 'netPence' | 'vatPence'>[],
): { vatRateBp: number; netPence: number; vatPence: number }[] {
  const map = new Map<number, { vatRateBp: number; netPence: number; vatPence: number }>();
  for (const l of lines) {
    const r = map.get(l.vatRateBp) ?? { vatRateBp: l.vatRateBp, netPence: 0, vatPence: 0 };
    r.netPence += l.netPence;
    r.vatPence += l.vatPence;
    map.set(l.vatRateBp, r);
  }
  return [...map.values()].sort((a, b) => b.vatRateBp - a.vatRateBp);
}
