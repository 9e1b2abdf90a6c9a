import {
  OVERVIEW_VAN_PRODUCTS_LISTED,
  placeHealthOf,
  stockHealthRank,
  type OverviewVan,
  type StockCell,
} from '@heatfleet/domain';

/**
 * Each van's stock health for the overview, product by product, by the same rule as the stock grid
 * and My van (`stockHealthOf`, booked jobs counted): the van's health is its worst product's. The products
 * listed are the first few not OK, worst first.
 */
export function vanStockHealth(
  levels: StockCell[],
  products: { id: number; name: string; pack_size_ml: number }[],
): (vanId: number) => OverviewVan['stock'] {
  const productById = new Map(products.map((p) => [p.id, p]));
  // Names put in order once: compared with localeCompare inside each van's sort, 200 vans x 100 products
  // made a million comparisons per overview.
  const nameRank = new Map(
    [...products].sort((a, b) => a.name.localeCompare(b.name)).map((p, i) => [p.id, i] as const),
  );
  const byVan = new Map<number, StockCell[]>();
  for (const cell of levels) {
    const cells = byVan.get(cell.locationId);
    if (cells) cells.push(cell);
    else byVan.set(cell.locationId, [cell]);
  }
  return (vanId) => {
    const cells = (byVan.get(vanId) ?? []).filter((c) => c.health !== 'no_par' && productById.has(c.productId));
    const { health, counts } = placeHealthOf(cells.map((c) => c.health));
    // Only the worst few products that need something are listed, what the card shows (issue 16: every van's 100
    // products made the answer 2.3 MB); the counts cover every product with a level.
    const notOk = cells.filter((c) => c.health !== 'ok');
    return {
      health,
      // An empty line or one short for booked jobs is below what it must hold too; the others pick them out.
      belowMinimum: counts.below_minimum + counts.empty + counts.short_for_jobs,
      outOfStock: counts.empty,
      shortForJobs: counts.short_for_jobs,
      belowTarget: counts.below_target,
      productsNotOk: notOk.length,
      products: notOk
        .sort(
          (a, b) =>
            stockHealthRank[a.health] - stockHealthRank[b.health] ||
            nameRank.get(a.productId)! - nameRank.get(b.productId)!,
        )
        .slice(0, OVERVIEW_VAN_PRODUCTS_LISTED)
        .map((c) => ({
          productId: c.productId,
          name: productById.get(c.productId)!.name,
          packSizeMl: productById.get(c.productId)!.pack_size_ml,
          usable: c.usable,
          target: c.need?.target ?? null,
          booked: c.booked,
          health: c.health,
        })),
    };
  };
}
