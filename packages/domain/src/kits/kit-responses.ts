import { z } from 'zod';
import { photoSchema } from '../photos/photo-schemas.ts';
import {
  custodyEventSchema,
  inspectionSchema,
  itemKindSchema,
  kitItemSchema,
  kitLabelSchema,
  kitSchema,
} from './kit-schemas.ts';

// The success bodies of the kit, item, item-kind and label routes: the API declares them, the
// client's queries parse with them.

export const kitListResponseSchema = z.object({ kits: z.array(kitSchema) });
export const kitResponseSchema = z.object({ kit: kitSchema });

/** A kit with its items, custody timeline (newest first) and inspections; also a kit custody answer. */
export const kitDetailResponseSchema = z.object({
  kit: kitSchema,
  items: z.array(kitItemSchema),
  events: z.array(custodyEventSchema),
  inspections: z.array(inspectionSchema),
});
export type KitDetailResponse = z.infer<typeof kitDetailResponseSchema>;

export const kitItemPageResponseSchema = z.object({
  items: z.array(kitItemSchema),
  total: z.number(),
  page: z.number(),
  pageSize: z.number(),
});
export type KitItemPageResponse = z.infer<typeof kitItemPageResponseSchema>;
export const kitItemResponseSchema = z.object({ item: kitItemSchema });

export const kitItemDetailResponseSchema = z.object({
  item: kitItemSchema,
  events: z.array(custodyEventSchema),
  inspections: z.array(inspectionSchema),
  photos: z.array(photoSchema),
});
export type KitItemDetailResponse = z.infer<typeof kitItemDetailResponseSchema>;

/** An item's custody answer: the item as it now stands and its timeline. */
export const itemCustodyResponseSchema = z.object({ item: kitItemSchema, events: z.array(custodyEventSchema) });
export type ItemCustodyResponse = z.infer<typeof itemCustodyResponseSchema>;

export const inspectionRecordedResponseSchema = z.object({ inspection: inspectionSchema, item: kitItemSchema });
export type InspectionRecordedResponse = z.infer<typeof inspectionRecordedResponseSchema>;

export const kitLabelListResponseSchema = z.object({ labels: z.array(kitLabelSchema) });
export type KitLabel = z.infer<typeof kitLabelSchema>;

export const itemKindListResponseSchema = z.object({ itemKinds: z.array(itemKindSchema) });
export const itemKindResponseSchema = z.object({ itemKind: itemKindSchema });
