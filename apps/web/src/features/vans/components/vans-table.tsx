import { useMemo } from 'react';
import { useQuery } from '@tanstack/react-query';
import { DataTable } from '@/components/ui/data-table';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { vanQueries } from '@/features/vans/api/van-queries';
import { buildVanColumns } from '@/features/vans/components/van-columns';

const initialSorting = [{ id: 'nextDue', desc: false }];

export function VansTable({ timeZone }: { timeZone: string }) {
  const vans = useQuery(vanQueries.list());
  const columns = useMemo(() => buildVanColumns(timeZone), [timeZone]);
  if (vans.isPending) return <PageSpinner label="Loading vans…" />;
  if (vans.isError) return <QueryErrorNotice error={vans.error} onRetry={() => void vans.refetch()} />;
  return (
    <DataTable
      columns={columns}
      data={vans.data}
      getRowId={(van) => String(van.id)}
      caption="Vans of the firm"
      filterLabel="Find a van, registration or engineer"
      itemsLabel="vans"
      emptyMessage="No vans yet."
      initialSorting={initialSorting}
    />
  );
}
