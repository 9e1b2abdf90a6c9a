import { useQuery } from '@tanstack/react-query';
import type { CustodyDepot, CustodyVan } from '@/features/kits/components/custody-shared';
import type { PlaceOption } from '@/features/kits/components/kit-items-table';
import { depotQueries, vanQueries } from '@/features/vans/api/van-queries';

/** The firm's vans and depots in the shapes the kit screens take, so kits need not know about vans. */
export function useFleetPlaces() {
  const vans = useQuery(vanQueries.list());
  const depots = useQuery(depotQueries.list());
  const custodyVans: CustodyVan[] = (vans.data ?? [])
    .filter((van) => van.active)
    .map((van) => ({
      id: van.id,
      name: van.name,
      registration: van.registration,
      engineerMemberId: van.engineer?.memberId ?? null,
      engineerName: van.engineer?.name ?? null,
    }));
  const custodyDepots: CustodyDepot[] = (depots.data ?? []).map((depot) => ({ id: depot.id, name: depot.name }));
  const places: PlaceOption[] = [
    ...custodyDepots.map((depot) => ({ id: depot.id, label: depot.name })),
    ...custodyVans.map((van) => ({ id: van.id, label: `${van.name} (${van.registration})` })),
  ];
  return {
    vans: custodyVans,
    depots: custodyDepots,
    places,
    isPending: vans.isPending || depots.isPending,
    error: vans.error ?? depots.error,
    refetch: () => Promise.all([vans.refetch(), depots.refetch()]),
  };
}
