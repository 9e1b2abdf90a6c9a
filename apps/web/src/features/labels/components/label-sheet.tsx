import type { z } from 'zod';
import type { kitLabelSchema } from '@heatfleet/domain';

type KitLabel = z.infer<typeof kitLabelSchema>;

/**
 * An A4 sheet of labels, three across: each with its QR code (opening the item's page), the asset
 * tag large enough to read from a van's shelf, the kind and the kit. Sized in millimetres for print.
 */
export function LabelSheet({ labels }: { labels: KitLabel[] }) {
  return (
    <ul aria-label="Labels" className="label-sheet grid grid-cols-2 gap-3 sm:grid-cols-3 print:gap-0">
      {labels.map((label) => (
        <li
          key={label.itemId}
          className="label flex break-inside-avoid flex-col items-center rounded-md border border-dashed border-line-strong bg-card p-3 text-center"
        >
          <img
            src={label.qrSvgDataUrl}
            alt={`QR code for ${label.assetTag}`}
            className="aspect-square w-full max-w-40"
          />
          <p className="mt-1 font-mono text-lg font-bold break-all">{label.assetTag}</p>
          <p className="text-sm">{label.kindName}</p>
          {label.kitName ? <p className="text-sm font-semibold">{label.kitName}</p> : null}
        </li>
      ))}
    </ul>
  );
}
