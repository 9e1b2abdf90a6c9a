import { sumPence } from './pence.ts';

// A firm's price list: what a visit costs for a number of radiators, chemicals at a sell price, extras.

export const priceVisitKinds = ['full_clean', 'inhibitor_only', 'annual_check'] as const;
export type PriceVisitKind = (typeof priceVisitKinds)[number];
export const priceVisitKindLabels: Record<PriceVisitKind, string> = {
  full_clean: 'Full clean',
  inhibitor_only: 'Inhibitor visit',
  annual_check: 'Annual check',
};

export const priceItemKinds = ['visit', 'chemical', 'extra'] as const;
export type PriceItemKind = (typeof priceItemKinds)[number];

export const visitPricings = ['per_radiator', 'bands'] as const;
export type VisitPricing = (typeof visitPricings)[number];

/** Up to and including `upToRadiators`, the visit costs `pricePence`; bands ascend. */
export interface RadiatorBand {
  upToRadiators: number;
  pricePence: number;
}

export interface VisitPrice {
  pricing: VisitPricing;
  basePence: number;
  perRadiatorPence: number;
  bands: RadiatorBand[];
}

/**
 * The visit's price for a count of radiators. per_radiator: base + rate × radiators. bands: the
 * first band that covers the count; above the last band, the last band's price plus the rate for each
 * radiator beyond it (so a big house is never priced as a small one). Null when no band covers it
 * and there is no rate to extend it: the price has to be typed in.
 */
export function visitPriceFor(price: VisitPrice, radiators: number): number | null {
  if (!Number.isInteger(radiators) || radiators < 0) throw new RangeError('Radiators must be a whole number.');
  if (price.pricing === 'per_radiator') return sumPence([price.basePence, price.perRadiatorPence * radiators]);
  const bands = [...price.bands].sort((a, b) => a.upToRadiators - b.upToRadiators);
  const band = bands.find((b) => radiators <= b.upToRadiators);
  if (band) return band.pricePence;
  const last = bands.at(-1);
  if (!last || price.perRadiatorPence === 0) return null;
  return last.pricePence + price.perRadiatorPence * (radiators - last.upToRadiators);
}

/** Bands must rise in radiators and never fall in price. Returns what is wrong, or null. */
export function bandsProblem(bands: readonly RadiatorBand[]): string | null {
  for (let i = 1; i < bands.length; i++) {
    const prev = bands[i - 1]!;
    const cur = bands[i]!;
    if (cur.upToRadiators <= prev.upToRadiators)
      return `Band ${i + 1} must cover more radiators than band ${i} (${prev.upToRadiators}).`;
    if (cur.pricePence < prev.pricePence) return `Band ${i + 1} cannot cost less than band ${i}.`;
  }
  return null;
}
