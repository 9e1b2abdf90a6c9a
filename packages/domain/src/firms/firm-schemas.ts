import { z } from 'zod';

export const DEFAULT_TIME_ZONE = 'Europe/London';

export const firmSchema = z.object({
  id: z.number(),
  name: z.string(),
  timeZone: z.string(),
});
export type Firm = z.infer<typeof firmSchema>;
