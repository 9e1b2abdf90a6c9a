import { Link } from 'react-router-dom';
import type { Van } from '@heatfleet/domain';
import { createDataTableColumnHelper, type DataTableColumns } from '@/components/ui/data-table-columns';
import { paths } from '@/config/paths';
import { VanDueDate } from '@/features/vans/components/van-due';

const helper = createDataTableColumnHelper<Van>();

export function buildVanColumns(timeZone: string): DataTableColumns<Van> {
  return helper.columns([
    helper.accessor('name', {
      header: 'Van',
      sortFn: 'alphanumeric',
      cell: (info) => (
        <Link
          to={paths.van.getHref(info.row.original.id)}
          className="font-semibold text-brand-700 underline underline-offset-4"
        >
          {info.getValue()}
        </Link>
      ),
    }),
    helper.accessor('registration', {
      header: 'Registration',
      sortFn: 'text',
      cell: (info) => <span className="font-mono whitespace-nowrap">{info.getValue()}</span>,
    }),
    helper.accessor((van) => van.engineer?.name ?? '', {
      id: 'engineer',
      header: 'Engineer',
      sortFn: 'text',
      cell: (info) => info.getValue() || <span className="text-ink-muted">Nobody</span>,
    }),
    helper.accessor((van) => van.kitsOnBoard.map((kit) => kit.name).join(', '), {
      id: 'kits',
      header: 'Kits on board',
      sortFn: 'text',
      cell: (info) => info.getValue() || <span className="text-ink-muted">None</span>,
    }),
    // Sorted by date, so the van due first comes first; vans with no date go last.
    helper.accessor((van) => van.nextDue?.on ?? '9999-12-31', {
      id: 'nextDue',
      header: 'Next MOT or service',
      sortFn: 'text',
      enableGlobalFilter: false,
      cell: (info) => {
        const next = info.row.original.nextDue;
        return (
          <VanDueDate
            label={next?.what === 'service' ? 'Service' : next ? 'MOT' : 'MOT or service'}
            date={next?.on ?? null}
            timeZone={timeZone}
          />
        );
      },
    }),
  ]);
}
