import type { LocationRef } from '@heatfleet/domain';

/** Where something is, in the words people use: "Van 1 (BK21 HFA), Jory Pennock" or "Depot". */
export function locationText(location: LocationRef | null): string {
  if (!location) return 'Nowhere recorded';
  if (location.kind === 'depot') return location.name;
  const reg = location.registration ? ` (${location.registration})` : '';
  return `${location.name}${reg}`;
}

export function LocationText({ location }: { location: LocationRef | null }) {
  if (!location) return <span className="text-ink-muted">Nowhere recorded</span>;
  return (
    <span>
      {locationText(location)}
      {location.kind === 'van' && location.engineerName ? (
        <span className="text-ink-muted"> · {location.engineerName}</span>
      ) : null}
    </span>
  );
}
