import { z } from 'zod';
import { reminderDeliverySchema, reminderSettingsViewSchema } from './reminder-schemas.ts';

// The success bodies of the reminder routes: the API declares them, the client's queries parse with them.

export const reminderListResponseSchema = z.object({ reminders: z.array(reminderDeliverySchema) });
/** How many reminders a scan found new and sent (0 when everything due was already reminded). */
export const reminderScanResponseSchema = z.object({ sent: z.number() });
export const reminderSettingsResponseSchema = z.object({ settings: reminderSettingsViewSchema });
