import { useQuery } from '@tanstack/react-query';
import type { StockPlace } from '@heatfleet/domain';
import { productQueries, stockQueries } from '@/features/stock/api/stock-queries';

export function placeLabel(place: StockPlace): string {
  return place.kind === 'van' && place.registration ? `${place.name} (${place.registration})` : place.name;
}

/** The places and products the stock forms choose from, taken from the grid so they match what it shows. */
export function useStockChoices() {
  const grid = useQuery(stockQueries.grid());
  const products = useQuery(productQueries.list());
  const places = grid.data?.places ?? [];
  return {
    isPending: grid.isPending || products.isPending,
    error: grid.error ?? products.error,
    retry: () => Promise.all([grid.refetch(), products.refetch()]),
    today: grid.data?.today ?? '',
    places,
    depots: places.filter((p) => p.kind === 'depot'),
    vans: places.filter((p) => p.kind === 'van'),
    products: (products.data ?? []).filter((p) => p.active),
  };
}
