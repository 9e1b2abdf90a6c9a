import { useMemo } from 'react';
import { useQuery } from '@tanstack/react-query';
import { reminderKindLabels, type ReminderDelivery } from '@heatfleet/domain';
import { DataTable } from '@/components/ui/data-table';
import { createDataTableColumnHelper } from '@/components/ui/data-table-columns';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { formatDateTime } from '@/lib/format';
import { reminderQueries } from '@/features/reminders/api/reminder-queries';

const helper = createDataTableColumnHelper<ReminderDelivery>();

function buildColumns(timeZone: string) {
  return helper.columns([
    helper.accessor((r) => r.sentAt ?? r.createdAt, {
      id: 'when',
      header: 'When',
      sortFn: 'text',
      enableGlobalFilter: false,
      cell: (info) => (
        <span className="whitespace-nowrap">
          {formatDateTime(info.getValue(), timeZone)}
          {info.row.original.sentAt ? null : <span className="text-ember-700"> · not sent yet</span>}
        </span>
      ),
    }),
    helper.accessor((r) => reminderKindLabels[r.kind], { id: 'kind', header: 'Why', sortFn: 'text' }),
    helper.accessor('summary', { header: 'What', sortFn: 'text' }),
    helper.accessor('recipient', { header: 'To', sortFn: 'text' }),
  ]);
}

const initialSorting = [{ id: 'when', desc: true }];

export function RemindersTable({ timeZone }: { timeZone: string }) {
  const reminders = useQuery(reminderQueries.list());
  const columns = useMemo(() => buildColumns(timeZone), [timeZone]);
  if (reminders.isPending) return <PageSpinner label="Loading reminders…" />;
  if (reminders.isError) return <QueryErrorNotice error={reminders.error} onRetry={() => void reminders.refetch()} />;
  return (
    <DataTable
      columns={columns}
      data={reminders.data}
      getRowId={(r) => String(r.id)}
      caption="Reminders sent"
      filterLabel="Find a reminder"
      itemsLabel="reminders"
      emptyMessage="No reminders have been sent yet."
      initialSorting={initialSorting}
      pageSize={25}
    />
  );
}
