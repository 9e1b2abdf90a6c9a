import type { KitItem } from '@heatfleet/domain';
import { DataTable } from '@/components/ui/data-table';
import { kitItemColumns } from '@/features/kits/components/kit-item-columns';

const initialSorting = [{ id: 'due', desc: true }];

/** The items of one kit or van, all sent at once: a few dozen at most. */
export function KitItemsList({ items, caption }: { items: KitItem[]; caption: string }) {
  return (
    <DataTable
      columns={kitItemColumns}
      data={items}
      getRowId={(item) => String(item.id)}
      caption={caption}
      filterLabel="Find an item"
      itemsLabel="items"
      emptyMessage="No items here."
      initialSorting={initialSorting}
      pageSize={25}
    />
  );
}
