import { useMemo, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { DataTable } from '@/components/ui/data-table';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { productQueries } from '@/features/stock/api/stock-queries';
import { GallonsToggle } from '@/features/stock/components/pack-size';
import { buildProductColumns } from '@/features/stock/components/product-columns';

const initialSorting = [{ id: 'name', desc: false }];

export function ProductsTable() {
  const products = useQuery(productQueries.list());
  const [showGallons, setShowGallons] = useState(false);
  const columns = useMemo(() => buildProductColumns(showGallons), [showGallons]);
  if (products.isPending) return <PageSpinner label="Loading products…" />;
  if (products.isError) return <QueryErrorNotice error={products.error} onRetry={() => void products.refetch()} />;
  return (
    <DataTable
      columns={columns}
      data={products.data}
      getRowId={(p) => String(p.id)}
      caption="Chemical products"
      filterLabel="Find a product"
      itemsLabel="products"
      emptyMessage="No products yet."
      initialSorting={initialSorting}
      toolbar={<GallonsToggle checked={showGallons} onChange={setShowGallons} />}
    />
  );
}
