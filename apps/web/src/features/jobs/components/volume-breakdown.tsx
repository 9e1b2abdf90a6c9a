import { useId, useState } from 'react';
import { litresToImperialGallons, type VolumeBreakdown as Volume } from '@heatfleet/domain';
import { Badge } from '@/components/ui/badge';

export function formatLitres(litres: number, withGallons: boolean): string {
  const l = `${litres.toFixed(1)} L`;
  return withGallons ? `${l} (${litresToImperialGallons(litres).toFixed(1)} gal)` : l;
}

/** The firm works in litres; imperial gallons are shown beside them on request. */
export function useGallonsToggle() {
  const [withGallons, setWithGallons] = useState(false);
  const id = useId();
  const toggle = (
    <div className="flex min-h-12 items-center gap-3">
      <input
        id={id}
        type="checkbox"
        className="size-6 accent-brand-700"
        checked={withGallons}
        onChange={(event) => setWithGallons(event.target.checked)}
      />
      <label htmlFor={id} className="font-semibold">
        Show imperial gallons too
      </label>
    </div>
  );
  return { withGallons, toggle };
}

export function VolumeBreakdown({ volume, withGallons }: { volume: Volume; withGallons: boolean }) {
  const parts: [string, number][] = [
    [volume.estimate ? 'Radiators and pipework (estimated)' : 'Radiators', volume.radiatorsLitres],
    ...(volume.estimate ? [] : [['Pipework', volume.pipeworkLitres] as [string, number]]),
    [
      volume.heatExchangerFrom === 'default'
        ? 'Boiler heat exchanger (default for the boiler)'
        : 'Boiler heat exchanger',
      volume.heatExchangerLitres,
    ],
    ['Cylinder coil', volume.cylinderCoilLitres],
    ['Other', volume.otherLitres],
  ];
  return (
    <div role="group" className="space-y-2" aria-label="System volume">
      <p className="flex flex-wrap items-center gap-2 text-xl font-bold text-brand-900">
        <span>System volume {formatLitres(volume.totalLitres, withGallons)}</span>
        {volume.estimate ? <Badge tone="warn">{volume.label}</Badge> : <Badge tone="ok">{volume.label}</Badge>}
      </p>
      <dl className="divide-y divide-line rounded-md border border-line">
        {parts.map(([label, litres]) => (
          <div key={label} className="flex justify-between gap-3 px-3 py-2">
            <dt>{label}</dt>
            <dd className="font-semibold whitespace-nowrap tabular-nums">{formatLitres(litres, withGallons)}</dd>
          </div>
        ))}
      </dl>
      <p className="text-sm text-ink-muted">{volume.howReached}</p>
    </div>
  );
}

export interface DoseFigures {
  product: { name: string; packSizeMl: number };
  litres: number | null;
  packsByVolume: number | null;
  packsByRadiators: number | null;
  packs: number;
  decidedBy: 'volume' | 'radiators' | 'none';
}

function packSizeText(ml: number): string {
  return ml >= 1000 ? `${Number((ml / 1000).toFixed(2))} L` : `${ml} ml`;
}

function packsText(n: number): string {
  return `${n} pack${n === 1 ? '' : 's'}`;
}

export function doseReason(dose: DoseFigures, radiators: number): string {
  if (dose.decidedBy === 'none') return 'This product has no dose rule: set one on the product to get a plan.';
  if (dose.decidedBy === 'radiators')
    return `The radiators rule wins: ${radiators} radiators need ${packsText(dose.packsByRadiators ?? 0)}, more than the volume needs.`;
  return dose.packsByRadiators === null
    ? 'By volume: the product has no radiators rule.'
    : `The volume rule wins (or ties): ${packsText(dose.packsByVolume ?? 0)} by volume against ${packsText(dose.packsByRadiators)} by radiators.`;
}

export function DoseSummary({
  dose,
  radiators,
  withGallons,
}: {
  dose: DoseFigures;
  radiators: number;
  withGallons: boolean;
}) {
  return (
    <div className="space-y-1">
      <p className="font-bold text-brand-900">
        {dose.product.name}: {packsText(dose.packs)}
        <span className="font-normal text-ink">
          {' '}
          · {dose.litres === null ? 'no rate' : `${dose.litres.toFixed(2)} L`}, packs of{' '}
          {packSizeText(dose.product.packSizeMl)}
        </span>
      </p>
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-base">
        <dt className="text-ink-muted">Product by volume</dt>
        <dd className="tabular-nums">
          {dose.litres === null ? 'No rate set' : `${dose.litres.toFixed(2)} L`}
          {withGallons && dose.litres !== null ? ` (${litresToImperialGallons(dose.litres).toFixed(2)} gal)` : ''}
        </dd>
        <dt className="text-ink-muted">Pack size</dt>
        <dd className="tabular-nums">{packSizeText(dose.product.packSizeMl)}</dd>
        <dt className="text-ink-muted">Packs by volume</dt>
        <dd className="tabular-nums">{dose.packsByVolume ?? 'None'}</dd>
        <dt className="text-ink-muted">Packs by radiators</dt>
        <dd className="tabular-nums">{dose.packsByRadiators ?? 'No rule'}</dd>
      </dl>
      <p className="text-sm">{doseReason(dose, radiators)}</p>
    </div>
  );
}
