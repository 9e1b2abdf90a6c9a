import { queryOptions } from '@tanstack/react-query';
import { havRegisterResponseSchema } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';

export function getHavRegister(weeks: number) {
  return apiClient.get(`/api/vibration/register?weeks=${weeks}`, havRegisterResponseSchema);
}

export const vibrationQueries = {
  all: () => ['vibration'] as const,
  registers: () => [...vibrationQueries.all(), 'register'] as const,
  register: (weeks: number) =>
    queryOptions({ queryKey: [...vibrationQueries.registers(), weeks] as const, queryFn: () => getHavRegister(weeks) }),
};
