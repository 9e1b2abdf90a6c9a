export interface DoseRule {
  packSizeMl: number;
  /** Litres of product per 100 litres of system water, from the product's label. */
  doseLitresPer100L: number | null;
  /** One pack per N radiators, where the product gives that rule of thumb. */
  radiatorsPerPack: number | null;
}

export interface DosePlan {
  litres: number | null;
  packsByVolume: number | null;
  packsByRadiators: number | null;
  packs: number;
  decidedBy: 'volume' | 'radiators' | 'none';
}

/**
 * Product litres = volume x rate / 100, rounded up to whole packs; and the packs-per-radiators
 * rule of thumb where the product has one. The larger wins, and the plan says which.
 */
export function dosePlan(volumeLitres: number, radiators: number, rule: DoseRule): DosePlan {
  const litres = rule.doseLitresPer100L === null ? null : (volumeLitres * rule.doseLitresPer100L) / 100;
  // A hair of tolerance so 2.0000000001 packs of floating point does not become 3. A pack size or
  // radiators-per-pack of 0 (never accepted, but guarded) gives no figure rather than Infinity.
  const packsByVolume =
    litres === null || !(rule.packSizeMl > 0)
      ? null
      : finiteOrNull(Math.ceil(litres / (rule.packSizeMl / 1000) - 1e-9));
  const packsByRadiators =
    rule.radiatorsPerPack === null || !(rule.radiatorsPerPack > 0)
      ? null
      : finiteOrNull(Math.ceil(radiators / rule.radiatorsPerPack));
  const v = packsByVolume ?? 0;
  const r = packsByRadiators ?? 0;
  const packs = Math.max(v, r);
  const decidedBy = packs === 0 ? 'none' : v >= r ? 'volume' : 'radiators';
  // Litres are shown to two decimals beside the packs; the packs were counted from the unrounded figure.
  return {
    litres: litres === null ? null : Math.round(litres * 100) / 100,
    packsByVolume,
    packsByRadiators,
    packs,
    decidedBy,
  };
}

function finiteOrNull(n: number): number | null {
  return Number.isFinite(n) ? n : null;
}
