import { z } from 'zod';
import { heatExchangerDefaultsSchema } from '../jobs/heat-exchanger.ts';
import { volumeUnits } from './firm-settings-schemas.ts';

// The success bodies of the firm settings routes: the API declares them, the client's queries parse with them.

export const firmSettingsSchema = z.object({
  id: z.number(),
  name: z.string(),
  address: z.string().nullable(),
  timeZone: z.string(),
  volumeUnit: z.enum(volumeUnits),
  coldBottomThresholdK: z.number(),
  phone: z.string().nullable(),
  email: z.string().nullable(),
  registrationNumbers: z.string().nullable(),
  /** The defaults in use: the firm's own, else the built-in ones (from memory). */
  heatExchangerDefaults: heatExchangerDefaultsSchema,
  /** False while the firm uses the built-in defaults. */
  heatExchangerDefaultsOwn: z.boolean(),
  /** Days of booked jobs the restock run covers. */
  restockDays: z.number(),
});
export type FirmSettings = z.infer<typeof firmSettingsSchema>;

export const firmSettingsResponseSchema = z.object({ firm: firmSettingsSchema });
