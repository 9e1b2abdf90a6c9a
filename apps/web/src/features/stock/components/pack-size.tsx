import { formatPackSize, litresToImperialGallons } from '@heatfleet/domain';

/** Litres by default; imperial gallons beside them when the person asked for them. */
export function packSizeText(ml: number, showGallons: boolean): string {
  const metric = formatPackSize(ml);
  if (!showGallons) return metric;
  const gallons = litresToImperialGallons(ml / 1000);
  return `${metric} (${gallons < 0.1 ? gallons.toFixed(3) : gallons.toFixed(2)} gal)`;
}

export function GallonsToggle({ checked, onChange }: { checked: boolean; onChange: (checked: boolean) => void }) {
  return (
    <label className="inline-flex min-h-12 cursor-pointer items-center gap-2 font-semibold">
      <input
        type="checkbox"
        className="size-5 accent-brand-700"
        checked={checked}
        onChange={(event) => onChange(event.target.checked)}
      />
      Show imperial gallons too
    </label>
  );
}
