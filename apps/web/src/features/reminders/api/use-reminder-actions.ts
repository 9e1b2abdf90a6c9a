import { useMutation, useQueryClient } from '@tanstack/react-query';
import { reminderScanResponseSchema, reminderSettingsResponseSchema, type ReminderSettings } from '@heatfleet/domain';
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
