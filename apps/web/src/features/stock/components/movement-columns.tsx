import { movementKindLabels, type Movement } from '@heatfleet/domain';
import { createDataTableColumnHelper, type DataTableColumns } from '@/components/ui/data-table-columns';
import { Button } from '@/components/ui/button';
import { formatCalendarDate, formatDateTime } from '@/lib/format';

const helper = createDataTableColumnHelper<Movement>();

/** `onReverse` is given only to members who may reverse; a reversal itself cannot be reversed. */
export function buildMovementColumns(
  timeZone: string,
  onReverse?: (movement: Movement) => void,
): DataTableColumns<Movement> {
  const actions = onReverse
    ? [
        helper.display({
          id: 'actions',
          header: () => <span className="sr-only">Actions</span>,
          meta: { hideCellLabel: true },
          cell: (info) =>
            info.row.original.kind === 'reversal' ? null : (
              <Button variant="quiet" className="px-1" onClick={() => onReverse(info.row.original)}>
                Reverse<span className="sr-only"> movement {info.row.original.id}</span>
              </Button>
            ),
        }),
      ]
    : [];
  return helper.columns([
    helper.accessor('createdAt', {
      header: 'When',
      sortFn: 'text',
      enableGlobalFilter: false,
      cell: (info) => {
        // Stock used from a phone carries when it was used (X-Tapped-At); shown first when it arrived later.
        const { tappedAt } = info.row.original;
        const late = tappedAt !== null && Date.parse(info.getValue()) - Date.parse(tappedAt) >= 60_000;
        return (
          <span className="whitespace-nowrap">
            {formatDateTime(late ? tappedAt : info.getValue(), timeZone)}
            {late ? (
              <span className="block text-xs text-ink-muted">sent {formatDateTime(info.getValue(), timeZone)}</span>
            ) : null}
          </span>
        );
      },
    }),
    helper.accessor((m) => movementKindLabels[m.kind], { id: 'kind', header: 'What', sortFn: 'text' }),
    helper.accessor((m) => m.location.name, { id: 'place', header: 'Place', sortFn: 'alphanumeric' }),
    helper.accessor((m) => m.product.name, { id: 'product', header: 'Product', sortFn: 'text' }),
    helper.accessor((m) => m.batch.lotNumber, {
      id: 'lot',
      header: 'Lot',
      sortFn: 'text',
      cell: (info) => (
        <span>
          <span className="font-mono">{info.getValue()}</span>
          <span className="block text-xs text-ink-muted">
            use by {formatCalendarDate(info.row.original.batch.expiresOn)}
          </span>
        </span>
      ),
    }),
    helper.accessor('quantityDelta', {
      header: 'Packs',
      sortFn: 'basic',
      enableGlobalFilter: false,
      cell: (info) => {
        const n = info.getValue();
        return (
          <span className={`font-semibold ${n < 0 ? 'text-danger-700' : 'text-ok-700'}`}>{n > 0 ? `+${n}` : n}</span>
        );
      },
    }),
    helper.accessor((m) => [m.reason, m.reference].filter(Boolean).join(' · '), {
      id: 'note',
      header: 'Reason or reference',
      sortFn: 'text',
      cell: (info) => info.getValue() || <span className="text-ink-muted">—</span>,
    }),
    helper.accessor('byName', { header: 'By', sortFn: 'text' }),
    ...actions,
  ]);
}
