import { queryOptions } from '@tanstack/react-query';
import { z } from 'zod';
import { reminderDeliverySchema, reminderSettingsViewSchema } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';

const remindersEnvelopeSchema = z.object({ reminders: z.array(reminderDeliverySchema) });
export const settingsEnvelopeSchema = z.object({ settings: reminderSettingsViewSchema });

export async function listReminders() {
  return (await apiClient.get('/api/reminders', remindersEnvelopeSchema)).reminders;
}

export async function getReminderSettings() {
  return (await apiClient.get('/api/reminder-settings', settingsEnvelopeSchema)).settings;
}

export const reminderQueries = {
  all: () => ['reminders'] as const,
  lists: () => [...reminderQueries.all(), 'list'] as const,
  list: () => queryOptions({ queryKey: reminderQueries.lists(), queryFn: listReminders }),
  settings: () => queryOptions({ queryKey: [...reminderQueries.all(), 'settings'] as const, queryFn: getReminderSettings }),
};
