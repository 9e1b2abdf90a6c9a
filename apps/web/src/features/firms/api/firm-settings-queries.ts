import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { firmSettingsResponseSchema, type FirmSettingsInput } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { sessionQueries } from '@/lib/auth';

export async function getFirmSettings() {
  return (await apiClient.get('/api/firm', firmSettingsResponseSchema)).firm;
}

export async function saveFirmSettings(input: FirmSettingsInput) {
  return (await apiClient.put('/api/firm', input, firmSettingsResponseSchema)).firm;
}

export const firmSettingsQueries = {
  all: () => ['firm-settings'] as const,
  detail: () => queryOptions({ queryKey: firmSettingsQueries.all(), queryFn: getFirmSettings }),
};

export function useSaveFirmSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveFirmSettings,
    onSuccess: (firm) => {
      queryClient.setQueryData(firmSettingsQueries.detail().queryKey, firm);
      // The firm's name and time zone also come with the signed-in member (header, dates everywhere).
      void queryClient.invalidateQueries({ queryKey: sessionQueries.me().queryKey });
    },
  });
}
