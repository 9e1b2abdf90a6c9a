import { z } from 'zod';
import { movementSchema, productKinds, productSchema, stockHealth } from './stock-schemas.ts';

// The success bodies of the stock routes: the API declares them, the client's queries parse with them.

export const productListResponseSchema = z.object({ products: z.array(productSchema) });
export const productResponseSchema = z.object({ product: productSchema });

const parSchema = z.object({ minimum: z.number(), target: z.number() });
const namedRefSchema = z.object({ id: z.number(), name: z.string() });

/** Usable and expired packs of one product at one place, against its par level. */
export const stockCellSchema = z.object({
  locationId: z.number(),
  productId: z.number(),
  usable: z.number(),
  expired: z.number(),
  par: parSchema.nullable(),
  health: z.enum(stockHealth),
});
export type StockCell = z.infer<typeof stockCellSchema>;

export const stockPlaceSchema = z.object({
  id: z.number(),
  kind: z.enum(['depot', 'van']),
  name: z.string(),
  registration: z.string().nullable(),
});
export type StockPlace = z.infer<typeof stockPlaceSchema>;

export const stockGridSchema = z.object({
  today: z.string(),
  products: z.array(z.object({ id: z.number(), name: z.string(), kind: z.enum(productKinds), packSizeMl: z.number() })),
  locations: z.array(stockPlaceSchema),
  cells: z.array(stockCellSchema),
});
export type StockGrid = z.infer<typeof stockGridSchema>;

export const batchStockRowSchema = z.object({
  location: namedRefSchema,
  product: namedRefSchema,
  batch: z.object({ id: z.number(), lotNumber: z.string(), expiresOn: z.string() }),
  quantity: z.number(),
  expired: z.boolean(),
});
export type BatchStockRow = z.infer<typeof batchStockRowSchema>;
export const batchStockResponseSchema = z.object({ batches: z.array(batchStockRowSchema) });

export const ledgerPageSchema = z.object({ movements: z.array(movementSchema), nextCursor: z.number().nullable() });
export type LedgerPage = z.infer<typeof ledgerPageSchema>;

/** A stock-changing request's answer: the movements it wrote, under one group. */
export const stockMovedSchema = z.object({ groupId: z.string(), movements: z.array(movementSchema) });
export type StockMoved = z.infer<typeof stockMovedSchema>;

export const parLevelRowSchema = z.object({
  locationId: z.number(),
  productId: z.number(),
  minimum: z.number(),
  target: z.number(),
});
export type ParLevelRow = z.infer<typeof parLevelRowSchema>;
export const parLevelListResponseSchema = z.object({ parLevels: z.array(parLevelRowSchema) });
export const parLevelResponseSchema = z.object({ parLevel: parLevelRowSchema });

const allocationSchema = z.object({
  batchId: z.number(),
  lotNumber: z.string(),
  expiresOn: z.string(),
  quantity: z.number(),
});

export const restockRunSchema = z.object({
  today: z.string(),
  depot: namedRefSchema,
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
      product: namedRefSchema,
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
      product: namedRefSchema,
    }),
  ),
});
export type RestockRun = z.infer<typeof restockRunSchema>;
export type RestockRunLine = RestockRun['lines'][number];
export type ReorderRow = RestockRun['reorder'][number];

export const restockAppliedSchema = z.object({ groupId: z.string() });
export type RestockApplied = z.infer<typeof restockAppliedSchema>;

/** The signed-in engineer's van and what is on it; van is null when they have none. */
export const myVanStockSchema = z.object({
  van: z.object({ id: z.number(), name: z.string(), registration: z.string().nullable() }).nullable(),
  stock: z.array(stockCellSchema.extend({ productName: z.string() })),
  batches: z.array(batchStockRowSchema),
});
export type MyVanStock = z.infer<typeof myVanStockSchema>;
