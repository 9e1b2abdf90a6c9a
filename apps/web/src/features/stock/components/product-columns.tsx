import { Link } from 'react-router-dom';
import { productKindLabel, type Product } from '@heatfleet/domain';
import { createDataTableColumnHelper, type DataTableColumns } from '@/components/ui/data-table-columns';
import { paths } from '@/config/paths';
import { packSizeText } from '@/features/stock/components/pack-size';

const helper = createDataTableColumnHelper<Product>();

export function targetRangeText(p: Pick<Product, 'targetMin' | 'targetMax' | 'targetUnit'>): string {
  if (p.targetMin === null && p.targetMax === null) return '';
  const unit = p.targetUnit ? ` ${p.targetUnit}` : '';
  if (p.targetMin !== null && p.targetMax !== null) return `${p.targetMin}–${p.targetMax}${unit}`;
  return p.targetMin !== null ? `at least ${p.targetMin}${unit}` : `at most ${p.targetMax}${unit}`;
}

export function doseText(p: Pick<Product, 'doseLitresPer100L' | 'radiatorsPerPack'>): string {
  const parts = [];
  if (p.doseLitresPer100L !== null) parts.push(`${p.doseLitresPer100L} L per 100 L of system water`);
  if (p.radiatorsPerPack !== null) parts.push(`1 pack per ${p.radiatorsPerPack} radiators`);
  return parts.join('; ');
}

export function buildProductColumns(showGallons: boolean): DataTableColumns<Product> {
  return helper.columns([
    helper.accessor('name', {
      header: 'Product',
      sortFn: 'alphanumeric',
      cell: (info) => (
        <Link
          to={paths.product.getHref(info.row.original.id)}
          className="font-semibold text-brand-700 underline underline-offset-4"
        >
          {info.getValue()}
        </Link>
      ),
    }),
    helper.accessor((p) => productKindLabel(p), { id: 'kind', header: 'Kind', sortFn: 'text' }),
    helper.accessor('packSizeMl', {
      header: 'Pack size',
      sortFn: 'basic',
      enableGlobalFilter: false,
      cell: (info) => <span className="whitespace-nowrap">{packSizeText(info.getValue(), showGallons)}</span>,
    }),
    helper.accessor((p) => doseText(p), {
      id: 'dose',
      header: 'Dose',
      sortFn: 'text',
      cell: (info) => info.getValue() || <span className="text-ink-muted">Not set</span>,
    }),
    helper.accessor((p) => targetRangeText(p), {
      id: 'target',
      header: 'Target',
      sortFn: 'text',
      cell: (info) => info.getValue() || <span className="text-ink-muted">—</span>,
    }),
    helper.accessor('shelfLifeMonths', {
      header: 'Shelf life',
      sortFn: 'basic',
      enableGlobalFilter: false,
      cell: (info) =>
        info.getValue() === null ? <span className="text-ink-muted">—</span> : `${info.getValue()} months`,
    }),
    helper.accessor((p) => (p.safetyDataSheet ? 'yes' : 'no'), {
      id: 'sds',
      header: 'Data sheet',
      enableSorting: false,
      enableGlobalFilter: false,
      cell: (info) => {
        const sds = info.row.original.safetyDataSheet;
        return sds ? (
          <a href={sds.url} download className="font-semibold text-brand-700 underline underline-offset-4">
            Download
          </a>
        ) : (
          <span className="font-semibold text-danger-700">Missing</span>
        );
      },
    }),
  ]);
}
