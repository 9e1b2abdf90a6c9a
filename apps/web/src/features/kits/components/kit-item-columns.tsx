import { Link } from 'react-router-dom';
import { inspectionStates, itemConditionLabels, type KitItem } from '@heatfleet/domain';
import { createDataTableColumnHelper, type DataTableColumns } from '@/components/ui/data-table-columns';
import { paths } from '@/config/paths';
import { ItemDue } from '@/features/kits/components/inspection-state';
import { locationText } from '@/features/kits/components/location-text';

const helper = createDataTableColumnHelper<KitItem>();

export const kitItemColumns: DataTableColumns<KitItem> = helper.columns([
  helper.accessor('assetTag', {
    header: 'Asset tag',
    sortFn: 'alphanumeric',
    cell: (info) => (
      <Link
        to={paths.kitItem.getHref(info.row.original.id)}
        className="font-mono font-semibold text-brand-700 underline underline-offset-4"
      >
        {info.getValue()}
      </Link>
    ),
  }),
  helper.accessor((item) => item.kind.name, { id: 'kind', header: 'Kind', sortFn: 'text' }),
  helper.accessor((item) => item.kit?.name ?? '', {
    id: 'kit',
    header: 'Kit',
    sortFn: 'text',
    cell: (info) => info.getValue() || <span className="text-ink-muted">Loose</span>,
  }),
  helper.accessor((item) => locationText(item.location), { id: 'where', header: 'Where', sortFn: 'text' }),
  helper.accessor((item) => itemConditionLabels[item.condition], {
    id: 'condition',
    header: 'Condition',
    // The server sorts the items list and has no condition order.
    enableSorting: false,
    cell: (info) => (
      <span className={info.row.original.condition === 'in_service' ? '' : 'font-semibold text-ember-700'}>
        {info.getValue()}
      </span>
    ),
  }),
  helper.accessor((item) => inspectionStates.indexOf(item.inspection.state), {
    id: 'due',
    header: 'Inspection',
    sortFn: 'basic',
    enableGlobalFilter: false,
    cell: (info) => <ItemDue item={info.row.original} />,
  }),
]);
