import { z } from 'zod';
import { volumeUnits } from './firm-settings-schemas.ts';

// The success bodies of the firm settings routes: the API declares them, the client's queries parse with them.

export const firmSettingsSchema = z.object({
  id: z.number(),
  name: z.string(),
  address: z.string().nullable(),
  timeZone: z.string(),
  volumeUnit: z.enum(volumeUnits),
  coldBottomThresholdK: z.number(),
});

export const firmSettingsResponseSchema = z.object({ firm: firmSettingsSchema });
