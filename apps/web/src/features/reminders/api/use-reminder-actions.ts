import { useMutation, useQueryClient } from '@tanstack/react-query';
import {
  marketingSuppressionResponseSchema,
  reminderScanResponseSchema,
  reminderSettingsResponseSchema,
  type MarketingSuppressionInput,
  type ReminderSettings,
} from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { reminderQueries } from '@/features/reminders/api/reminder-queries';

export async function saveReminderSettings(settings: ReminderSettings) {
  return (await apiClient.put('/api/reminder-settings', settings, reminderSettingsResponseSchema)).settings;
}

export async function runReminderScan() {
  return (await apiClient.post('/api/reminders/scan', {}, reminderScanResponseSchema)).sent;
}

export function useSaveReminderSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveReminderSettings,
    onSuccess: (settings) => queryClient.setQueryData(reminderQueries.settings().queryKey, settings),
  });
}

export function useRunReminderScan() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: runReminderScan,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: reminderQueries.lists() }),
  });
}

export async function addSuppression(input: MarketingSuppressionInput) {
  return (await apiClient.post('/api/marketing-suppressions', input, marketingSuppressionResponseSchema)).suppression;
}

export function useAddSuppression() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: addSuppression,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: reminderQueries.suppressions().queryKey }),
  });
}
