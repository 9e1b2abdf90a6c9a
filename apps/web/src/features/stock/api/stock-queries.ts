import { infiniteQueryOptions, queryOptions } from '@tanstack/react-query';
import { z } from 'zod';
import { movementKinds, movementSchema, productKinds, productSchema, stockHealth } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';

// The API answers these without a shared schema, so the client pins down the fields it reads.
const parSchema = z.object({ minimum: z.number(), target: z.number() });
const healthSchema = z.enum(stockHealth);

const stockCellSchema = z.object({
  locationId: z.number(),
  productId: z.number(),
  usable: z.number(),
  expired: z.number(),
  par: parSchema.nullable(),
  health: healthSchema,
});
export type StockCell = z.infer<typeof stockCellSchema>;

const stockGridSchema = z.object({
  today: z.string(),
  products: z.array(z.object({ id: z.number(), name: z.string(), kind: z.enum(productKinds), packSizeMl: z.number() })),
  locations: z.array(z.object({ id: z.number(), kind: z.enum(['depot', 'van']), name: z.string(), registration: z.string().nullable() })),
  cells: z.array(stockCellSchema),
});
export type StockGrid = z.infer<typeof stockGridSchema>;
export type StockPlace = StockGrid['locations'][number];

const batchStockSchema = z.object({
  location: z.object({ id: z.number(), name: z.string() }),
  product: z.object({ id: z.number(), name: z.string() }),
  batch: z.object({ id: z.number(), lotNumber: z.string(), expiresOn: z.string() }),
  quantity: z.number(),
  expired: z.boolean(),
});
export type BatchStockRow = z.infer<typeof batchStockSchema>;
const batchesSchema = z.object({ batches: z.array(batchStockSchema) });

const ledgerPageSchema = z.object({ movements: z.array(movementSchema), nextCursor: z.number().nullable() });

const allocationSchema = z.object({ batchId: z.number(), lotNumber: z.string(), expiresOn: z.string(), quantity: z.number() });
const restockRunSchema = z.object({
  today: z.string(),
  depot: z.object({ id: z.number(), name: z.string() }),
  lines: z.array(
    z.object({
      locationId: z.number(),
      productId: z.number(),
      usable: z.number(),
      par: parSchema,
      wanted: z.number(),
      allocations: z.array(allocationSchema),
      shortfall: z.number(),
      van: z.object({ id: z.number(), name: z.string(), registration: z.string().nullable() }),
      product: z.object({ id: z.number(), name: z.string() }),
    }),
  ),
  reorder: z.array(
    z.object({
      productId: z.number(),
      usableAfterTransfers: z.number(),
      par: parSchema,
      orderQuantity: z.number(),
      used90Days: z.number(),
      daysOfCover: z.number().nullable(),
      product: z.object({ id: z.number(), name: z.string() }),
    }),
  ),
});
export type RestockRun = z.infer<typeof restockRunSchema>;
export type RestockRunLine = RestockRun['lines'][number];
export type ReorderRow = RestockRun['reorder'][number];

const parLevelsSchema = z.object({
  parLevels: z.array(z.object({ locationId: z.number(), productId: z.number(), minimum: z.number(), target: z.number() })),
});

const myVanStockSchema = z.object({
  van: z.object({ id: z.number(), name: z.string(), registration: z.string().nullable() }).nullable(),
  stock: z.array(stockCellSchema.extend({ productName: z.string() })),
  batches: z.array(batchStockSchema),
});
export type MyVanStock = z.infer<typeof myVanStockSchema>;

export const productsEnvelopeSchema = z.object({ products: z.array(productSchema) });
export const productEnvelopeSchema = z.object({ product: productSchema });

export interface LedgerFilters {
  locationId?: number | undefined;
  productId?: number | undefined;
  kind?: (typeof movementKinds)[number] | undefined;
  from?: string | undefined;
  to?: string | undefined;
}

function searchOf(values: Record<string, string | number | undefined>): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(values)) if (value !== undefined && value !== '') params.set(key, String(value));
  const text = params.toString();
  return text ? `?${text}` : '';
}

/** A plain link: the browser downloads it with the session cookie, so a big export never sits in memory here. */
export function ledgerCsvHref(filters: LedgerFilters): string {
  return `/api/stock/movements.csv${searchOf({ ...filters })}`;
}

export const reorderCsvHref = '/api/stock/reorder-list.csv';

export const LEDGER_PAGE_SIZE = 50;

export const productQueries = {
  all: () => ['products'] as const,
  lists: () => [...productQueries.all(), 'list'] as const,
  list: () =>
    queryOptions({
      queryKey: productQueries.lists(),
      queryFn: async () => (await apiClient.get('/api/products', productsEnvelopeSchema)).products,
    }),
  detail: (id: number) =>
    queryOptions({
      queryKey: [...productQueries.all(), 'detail', id] as const,
      queryFn: async () => (await apiClient.get(`/api/products/${id}`, productEnvelopeSchema)).product,
    }),
};

export const stockQueries = {
  all: () => ['stock'] as const,
  grid: () => queryOptions({ queryKey: [...stockQueries.all(), 'grid'] as const, queryFn: () => apiClient.get('/api/stock', stockGridSchema) }),
  batches: (where: { locationId?: number; productId?: number }) =>
    queryOptions({
      queryKey: [...stockQueries.all(), 'batches', where] as const,
      queryFn: async () => (await apiClient.get(`/api/stock/batches${searchOf(where)}`, batchesSchema)).batches,
    }),
  ledgers: () => [...stockQueries.all(), 'ledger'] as const,
  ledger: (filters: LedgerFilters) =>
    infiniteQueryOptions({
      queryKey: [...stockQueries.ledgers(), filters] as const,
      queryFn: ({ pageParam }) =>
        apiClient.get(`/api/stock/movements${searchOf({ ...filters, before: pageParam ?? undefined, limit: LEDGER_PAGE_SIZE })}`, ledgerPageSchema),
      initialPageParam: null as number | null,
      getNextPageParam: (last) => last.nextCursor,
    }),
  restockRun: () =>
    queryOptions({ queryKey: [...stockQueries.all(), 'restock-run'] as const, queryFn: () => apiClient.get('/api/stock/restock-run', restockRunSchema) }),
  parLevels: () =>
    queryOptions({
      queryKey: [...stockQueries.all(), 'par-levels'] as const,
      queryFn: async () => (await apiClient.get('/api/par-levels', parLevelsSchema)).parLevels,
    }),
  mine: () => queryOptions({ queryKey: [...stockQueries.all(), 'mine'] as const, queryFn: () => apiClient.get('/api/me/van/stock', myVanStockSchema) }),
};
