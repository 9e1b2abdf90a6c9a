import { z } from 'zod';
import { kitItemSchema, kitSchema } from '../kits/kit-schemas.ts';
import { depotSchema, vanSchema } from './location-schemas.ts';

// The success bodies of the van and depot routes: the API declares them, the client's queries parse with them.

export const vanListResponseSchema = z.object({ vans: z.array(vanSchema) });
export const vanResponseSchema = z.object({ van: vanSchema });

/** A van with the kits and items on board. */
export const vanDetailResponseSchema = z.object({
  van: vanSchema,
  kits: z.array(kitSchema),
  items: z.array(kitItemSchema),
});
export type VanDetailResponse = z.infer<typeof vanDetailResponseSchema>;

/** The signed-in engineer's own van; van is null (and the lists empty) without one. */
export const myVanResponseSchema = vanDetailResponseSchema.extend({ van: vanSchema.nullable() });
export type MyVanResponse = z.infer<typeof myVanResponseSchema>;

export const depotListResponseSchema = z.object({ depots: z.array(depotSchema) });
export const depotResponseSchema = z.object({ depot: depotSchema });
