import { Link } from 'react-router-dom';
import { inspectionStates, type Kit } from '@heatfleet/domain';
import { createDataTableColumnHelper, type DataTableColumns } from '@/components/ui/data-table-columns';
import { paths } from '@/config/paths';
import { InspectionStateBadge } from '@/features/kits/components/inspection-state';
import { locationText } from '@/features/kits/components/location-text';

const helper = createDataTableColumnHelper<Kit>();

export const kitColumns: DataTableColumns<Kit> = helper.columns([
  helper.accessor('name', {
    header: 'Kit',
    sortFn: 'alphanumeric',
    cell: (info) => (
      <Link
        to={paths.kit.getHref(info.row.original.id)}
        className="font-semibold text-brand-700 underline underline-offset-4"
      >
        {info.getValue()}
      </Link>
    ),
  }),
  helper.accessor((kit) => locationText(kit.location), { id: 'where', header: 'Where', sortFn: 'text' }),
  helper.accessor((kit) => (kit.location?.kind === 'van' ? (kit.location.engineerName ?? '') : ''), {
    id: 'holder',
    header: 'Holder',
    sortFn: 'text',
    cell: (info) => info.getValue() || <span className="text-ink-muted">In stores</span>,
  }),
  helper.accessor('itemCount', { header: 'Items', sortFn: 'basic', enableGlobalFilter: false }),
  // Ranked worst last, so sorting descending puts overdue kits on top.
  helper.accessor((kit) => inspectionStates.indexOf(kit.inspectionState), {
    id: 'due',
    header: 'Due state',
    sortFn: 'basic',
    enableGlobalFilter: false,
    cell: (info) => (
      <span className="inline-flex flex-wrap items-center gap-2">
        <InspectionStateBadge state={info.row.original.inspectionState} />
        {info.row.original.needsAttention > 0 ? (
          <span className="text-sm text-ember-700">{info.row.original.needsAttention} need attention</span>
        ) : null}
      </span>
    ),
  }),
]);
