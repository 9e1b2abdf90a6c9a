import { useQuery } from '@tanstack/react-query';
import { DataTable } from '@/components/ui/data-table';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { kitQueries } from '@/features/kits/api/kit-queries';
import { kitColumns } from '@/features/kits/components/kit-columns';
import type { Kit } from '@heatfleet/domain';

const initialSorting = [{ id: 'name', desc: false }];

/** A fixed list of kits (a van's), or every kit of the firm when none is given. */
export function KitsTable({ kits, caption = 'Kits of the firm' }: { kits?: Kit[]; caption?: string }) {
  const query = useQuery({ ...kitQueries.list(), enabled: kits === undefined });
  if (kits === undefined && query.isPending) return <PageSpinner label="Loading kits…" />;
  if (kits === undefined && query.isError)
    return <QueryErrorNotice error={query.error} onRetry={() => void query.refetch()} />;
  return (
    <DataTable
      columns={kitColumns}
      data={kits ?? query.data ?? []}
      getRowId={(kit) => String(kit.id)}
      caption={caption}
      filterLabel="Find a kit"
      itemsLabel="kits"
      emptyMessage="No kits here."
      initialSorting={initialSorting}
    />
  );
}
