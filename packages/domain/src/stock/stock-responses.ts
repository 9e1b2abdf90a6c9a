import { z } from 'zod';
import { stockHealth } from './stock-health.ts';
import { movementSchema, productKinds, productSchema } from './stock-schemas.ts';

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
  /** Packs the place's booked jobs of the next days need (vans only; 0 otherwise). */
  booked: z.number(),
  /** What it should hold: the par level, its target raised to cover the booked jobs (see `stockNeedOf`). */
  need: parSchema.nullable(),
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

/** Places per page of the stock grid unless asked otherwise, and at most. */
export const STOCK_GRID_PAGE_SIZE = 20;
export const STOCK_GRID_MAX_PAGE_SIZE = 100;

/** `GET /api/stock?page=&limit=`: the grid is paged by place (columns), depots first, then by name. */
export const stockGridQuerySchema = z.strictObject({
  page: z.coerce
    .number({ error: 'Page must be a whole number from 1.' })
    .int('Page must be a whole number from 1.')
    .min(1, 'Page must be a whole number from 1.')
    .max(10_000, 'Page must be at most 10000.')
    .default(1),
  limit: z.coerce
    .number({ error: `Places per page must be a whole number from 1 to ${STOCK_GRID_MAX_PAGE_SIZE}.` })
    .int(`Places per page must be a whole number from 1 to ${STOCK_GRID_MAX_PAGE_SIZE}.`)
    .min(1, `Places per page must be a whole number from 1 to ${STOCK_GRID_MAX_PAGE_SIZE}.`)
    .max(STOCK_GRID_MAX_PAGE_SIZE, `Places per page must be a whole number from 1 to ${STOCK_GRID_MAX_PAGE_SIZE}.`)
    .default(STOCK_GRID_PAGE_SIZE),
});
export type StockGridQuery = z.infer<typeof stockGridQuerySchema>;

export const stockGridSchema = z.object({
  today: z.string(),
  /** Days ahead the booked jobs are counted over (the firm's restock setting). */
  restockDays: z.number(),
  products: z.array(z.object({ id: z.number(), name: z.string(), kind: z.enum(productKinds), packSizeMl: z.number() })),
  /** The places of this page: the grid's columns. */
  locations: z.array(stockPlaceSchema),
  /** Every active place, depots first, then by name (what the stock forms choose from). */
  places: z.array(stockPlaceSchema),
  page: z.object({
    page: z.number(),
    limit: z.number(),
    placeCount: z.number(),
    pageCount: z.number(),
  }),
  /** The cells of this page's places only. */
  cells: z.array(stockCellSchema),
  /** Each product over every place (every page): usable and expired packs, and what booked jobs need. */
  totals: z.array(z.object({ productId: z.number(), usable: z.number(), expired: z.number(), booked: z.number() })),
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

const productRefSchema = namedRefSchema.extend({ packSizeMl: z.number() });

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
      /** The van's par level (0 and 0 when it has none but booked jobs need the product). */
      par: parSchema,
      /** Packs its booked jobs of the next days need. */
      booked: z.number(),
      /** What the run fills to: the par target, or the booked packs plus the minimum if more. */
      need: parSchema,
      wanted: z.number(),
      allocations: z.array(allocationSchema),
      shortfall: z.number(),
    }),
  ),
  /**
   * The vans and products the lines name (by `locationId` and `productId`), each once: named on every line, they
   * were about a third of the 200-van firm's 3.1 MB answer (issue 16).
   */
  vans: z.array(z.object({ id: z.number(), name: z.string(), registration: z.string().nullable() })),
  products: z.array(productRefSchema),
  restockDays: z.number(),
  reorder: z.array(
    z.object({
      productId: z.number(),
      usableAfterTransfers: z.number(),
      par: parSchema,
      orderQuantity: z.number(),
      used90Days: z.number(),
      daysOfCover: z.number().nullable(),
      product: productRefSchema.extend({ supplierCode: z.string().nullable(), costPricePence: z.number().nullable() }),
      /** Order packs x cost price; null when the product has no cost price. */
      lineCostPence: z.number().nullable(),
    }),
  ),
  /** The reorder list's cost, over the lines with a cost price. */
  reorderTotalPence: z.number(),
});
export type RestockRun = z.infer<typeof restockRunSchema>;
export type RestockRunLine = RestockRun['lines'][number];
/** A restock line with its van and product joined from the run's `vans` and `products` (what a review shows). */
export type RestockRunNamedLine = RestockRunLine & {
  van: RestockRun['vans'][number];
  product: RestockRun['products'][number];
};

/** The run's lines with their vans and products joined, for a review; a line whose van or product is missing is left out. */
export function restockRunNamedLines(run: RestockRun): RestockRunNamedLine[] {
  const vans = new Map(run.vans.map((v) => [v.id, v]));
  const products = new Map(run.products.map((p) => [p.id, p]));
  return run.lines.flatMap((line) => {
    const van = vans.get(line.locationId);
    const product = products.get(line.productId);
    return van && product ? [{ ...line, van, product }] : [];
  });
}
export type ReorderRow = RestockRun['reorder'][number];

export const restockAppliedSchema = z.object({ groupId: z.string() });
export type RestockApplied = z.infer<typeof restockAppliedSchema>;

/** The signed-in engineer's van and what is on it; van is null when they have none. */
export const myVanStockSchema = z.object({
  van: z.object({ id: z.number(), name: z.string(), registration: z.string().nullable() }).nullable(),
  stock: z.array(stockCellSchema.extend({ productName: z.string(), packSizeMl: z.number() })),
  batches: z.array(batchStockRowSchema),
});
export type MyVanStock = z.infer<typeof myVanStockSchema>;

/** Booked jobs of the restock window whose van will not hold their packs (GET /api/stock/booked-jobs-short). */
export const bookedJobsShortSchema = z.object({
  today: z.string(),
  days: z.number(),
  jobs: z.array(
    z.object({
      jobId: z.number(),
      scheduledOn: z.string(),
      address: z.string(),
      van: namedRefSchema,
      short: z.array(
        z.object({
          product: productRefSchema,
          packs: z.number(),
          available: z.number(),
          shortBy: z.number(),
        }),
      ),
    }),
  ),
});
export type BookedJobsShort = z.infer<typeof bookedJobsShortSchema>;

export const bookedJobsShortQuerySchema = z.strictObject({
  engineerMemberId: z.coerce
    .number({ error: 'The engineer must be a member id.' })
    .int({ error: 'The engineer must be a member id.' })
    .positive({ error: 'The engineer must be a member id.' })
    .optional(),
});
