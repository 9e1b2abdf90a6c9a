import type { ParLevel } from './restock.ts';

// The one rule for stock health, per place and product. Every screen (the stock grid, My van, the
// owner's overview) and the restock run read it from here, so a van the grid shows below target is
// never "Stock OK" elsewhere.

export const stockHealth = ['no_par', 'ok', 'below_target', 'below_minimum', 'short_for_jobs', 'empty'] as const;
export type StockHealth = (typeof stockHealth)[number];

export const stockHealthLabels: Record<StockHealth, string> = {
  no_par: 'No level set',
  ok: 'Stocked',
  below_target: 'Below target',
  below_minimum: 'Below minimum',
  short_for_jobs: 'Short for booked jobs',
  empty: 'None usable',
};

/** Worst first: the order a list of products is shown in, and how a van's overall health is chosen. */
export const stockHealthRank: Record<StockHealth, number> = {
  empty: 0,
  short_for_jobs: 1,
  below_minimum: 2,
  below_target: 3,
  ok: 4,
  no_par: 5,
};

/**
 * What a place should hold of a product: its par target, or what its booked jobs of the next days
 * need plus its minimum (so the minimum is still there after the jobs), whichever is larger.
 * Null when the place has no par level and no booked job needs the product.
 */
export function stockNeedOf(par: ParLevel | null, bookedPacks = 0): ParLevel | null {
  if (!par && bookedPacks <= 0) return null;
  const minimum = par?.minimum ?? 0;
  return { minimum, target: Math.max(par?.target ?? 0, bookedPacks + minimum) };
}

/**
 * A place's health for one product: nothing usable; fewer usable packs than its booked jobs need;
 * under the minimum; under the target (par, raised for booked jobs); or stocked.
 */
export function stockHealthOf(usable: number, par: ParLevel | null, bookedPacks = 0): StockHealth {
  const need = stockNeedOf(par, bookedPacks);
  if (!need) return 'no_par';
  if (usable <= 0 && (need.minimum > 0 || bookedPacks > 0)) return 'empty';
  if (usable < bookedPacks) return 'short_for_jobs';
  if (usable < need.minimum) return 'below_minimum';
  if (usable < need.target) return 'below_target';
  return 'ok';
}

/** A place's health over its products: the worst product's, and how many products sit at each state. */
export function placeHealthOf(healths: StockHealth[]): {
  health: StockHealth;
  counts: Record<StockHealth, number>;
} {
  const counts = Object.fromEntries(stockHealth.map((h) => [h, 0])) as Record<StockHealth, number>;
  for (const h of healths) counts[h] += 1;
  const judged = healths.filter((h) => h !== 'no_par');
  const health = judged.length
    ? judged.reduce((worst, h) => (stockHealthRank[h] < stockHealthRank[worst] ? h : worst))
    : 'no_par';
  return { health, counts };
}
