import { useMutation, useQueryClient } from '@tanstack/react-query';
import { memberResponseSchema, type UpdateMemberInput } from '@heatfleet/domain';
import { apiClient } from '@/lib/api-client';
import { memberQueries } from '@/features/team/api/member-queries';

export async function updateMember({ id, ...input }: UpdateMemberInput & { id: number }) {
  return (await apiClient.patch(`/api/members/${id}`, input, memberResponseSchema)).member;
}

export function useUpdateMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateMember,
    onSettled: () => queryClient.invalidateQueries({ queryKey: memberQueries.lists() }),
  });
}
