import { z } from 'zod';

export const reminderKinds = ['inspection_due', 'mot_due', 'service_due'] as const;
export const reminderKindLabels: Record<(typeof reminderKinds)[number], string> = {
  inspection_due: 'Inspection due',
  mot_due: 'MOT due',
  service_due: 'Van service due',
};

export const reminderSettingsSchema = z.strictObject({
  scanHour: z.number().int().min(0, { error: 'Hour must be 0 to 23.' }).max(23, { error: 'Hour must be 0 to 23.' }),
  inspectionReminders: z.boolean(),
  vanReminders: z.boolean(),
});
export type ReminderSettings = z.infer<typeof reminderSettingsSchema>;

export const reminderDeliverySchema = z.object({
  id: z.number(),
  kind: z.enum(reminderKinds),
  /** What it is about, for a link: a kit item's or a van's id. */
  subjectType: z.enum(['kit_item', 'van']),
  subjectId: z.number(),
  summary: z.string(),
  recipient: z.string(),
  sentAt: z.string().nullable(),
  createdAt: z.string(),
});
export type ReminderDelivery = z.infer<typeof reminderDeliverySchema>;

/** Vans are reminded of MOT and service this many days ahead. */
export const VAN_DUE_WINDOW_DAYS = 30;

/** A firm's reminder settings as the API answers them: the editable part plus when the last scan ran. */
export const reminderSettingsViewSchema = reminderSettingsSchema.extend({
  lastScanOn: z.string().nullable(),
});
export type ReminderSettingsView = z.infer<typeof reminderSettingsViewSchema>;

/** Without a settings row a firm gets every reminder, scanned from 07:00 in its time zone. */
export const defaultReminderSettings: ReminderSettings = { scanHour: 7, inspectionReminders: true, vanReminders: true };
