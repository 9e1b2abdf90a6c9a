import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { ReminderSettings } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { reminderQueries, settingsEnvelopeSchema } from '@/features/reminders/api/reminder-queries';

const scanAnswerSchema = z.object({ sent: z.number() });

export async function saveReminderSettings(settings: ReminderSettings) {
  return (await apiClient.put('/api/reminder-settings', settings, settingsEnvelopeSchema)).settings;
}

export async function runReminderScan() {
  return (await apiClient.post('/api/reminders/scan', {}, scanAnswerSchema)).sent;
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
