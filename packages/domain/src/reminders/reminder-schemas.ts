import { z } from 'zod';

export const reminderKinds = [
  'inspection_due',
  'mot_due',
  'service_due',
  'van_below_minimum',
  'depot_reorder',
  'batch_expiring',
  'annual_check_due',
  'invoice_overdue',
] as const;
export type ReminderKind = (typeof reminderKinds)[number];
export const reminderKindLabels: Record<ReminderKind, string> = {
  inspection_due: 'Inspection due',
  mot_due: 'MOT due',
  service_due: 'Van service due',
  van_below_minimum: 'Van below minimum stock',
  depot_reorder: 'Depot reorder',
  batch_expiring: 'Batch expiring',
  annual_check_due: 'Annual check due',
  invoice_overdue: 'Invoice overdue',
};

/** What a reminder is about, for a link: a kit item, a van, a product (depot reorders), a batch or a customer's site. */
export const reminderSubjectTypes = ['kit_item', 'van', 'product', 'batch', 'site', 'invoice'] as const;
export type ReminderSubjectType = (typeof reminderSubjectTypes)[number];

export const reminderSettingsSchema = z.strictObject({
  scanHour: z.number().int().min(0, { error: 'Hour must be 0 to 23.' }).max(23, { error: 'Hour must be 0 to 23.' }),
  inspectionReminders: z.boolean(),
  vanReminders: z.boolean(),
  // Optional so a client written before stock reminders existed can still save the other settings:
  // left out, the firm's current choice stays as it is.
  stockReminders: z.boolean().optional(),
  annualCheckReminders: z.boolean().optional(),
  /** Also e-mail each customer whose e-mail is on file when their site falls due (off by default). */
  annualCheckCustomerEmails: z.boolean().optional(),
});
export type ReminderSettings = z.infer<typeof reminderSettingsSchema>;

export const reminderDeliverySchema = z.object({
  id: z.number(),
  kind: z.enum(reminderKinds),
  subjectType: z.enum(reminderSubjectTypes),
  subjectId: z.number(),
  summary: z.string(),
  recipient: z.string(),
  sentAt: z.string().nullable(),
  createdAt: z.string(),
});
export type ReminderDelivery = z.infer<typeof reminderDeliverySchema>;

/** Vans are reminded of MOT and service this many days ahead. */
export const VAN_DUE_WINDOW_DAYS = 30;

/** A batch still held anywhere is reminded this many days before its expiry: common practice (no source). */
export const BATCH_EXPIRY_WINDOW_DAYS = 60;

/** A firm's reminder settings as the API answers them: every switch, plus when the last scan ran. */
export const reminderSettingsViewSchema = reminderSettingsSchema.extend({
  stockReminders: z.boolean(),
  annualCheckReminders: z.boolean(),
  annualCheckCustomerEmails: z.boolean(),
  lastScanOn: z.string().nullable(),
});
export type ReminderSettingsView = z.infer<typeof reminderSettingsViewSchema>;

/** Without a settings row a firm gets every reminder, scanned from 07:00 in its time zone. */
export const defaultReminderSettings: Omit<ReminderSettingsView, 'lastScanOn'> = {
  scanHour: 7,
  inspectionReminders: true,
  vanReminders: true,
  stockReminders: true,
  annualCheckReminders: true,
  annualCheckCustomerEmails: false,
};

/** A customer's site is reminded this many days before its annual inhibitor check: common practice (no source). */
export const ANNUAL_CHECK_WINDOW_DAYS = 30;
