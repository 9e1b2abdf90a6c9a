import { queryOptions } from '@tanstack/react-query';
import {
  marketingSuppressionListResponseSchema,
  reminderListResponseSchema,
  reminderSettingsResponseSchema,
} from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';

export async function listReminders() {
  return (await apiClient.get('/api/reminders', reminderListResponseSchema)).reminders;
}

export async function getReminderSettings() {
  return (await apiClient.get('/api/reminder-settings', reminderSettingsResponseSchema)).settings;
}

export async function listSuppressions() {
  return (await apiClient.get('/api/marketing-suppressions', marketingSuppressionListResponseSchema)).suppressions;
}

export const reminderQueries = {
  all: () => ['reminders'] as const,
  lists: () => [...reminderQueries.all(), 'list'] as const,
  list: () => queryOptions({ queryKey: reminderQueries.lists(), queryFn: listReminders }),
  settings: () =>
    queryOptions({ queryKey: [...reminderQueries.all(), 'settings'] as const, queryFn: getReminderSettings }),
  suppressions: () =>
    queryOptions({ queryKey: [...reminderQueries.all(), 'suppressions'] as const, queryFn: listSuppressions }),
};
