import { useQuery } from '@tanstack/react-query';
import type { EngineerOption } from '@/features/vans/components/van-form';
import { memberQueries } from '@/features/team/api/member-queries';

/** Active members who can drive a van, for the van form's engineer choice. */
export function useEngineerOptions(enabled: boolean): EngineerOption[] {
  const members = useQuery({ ...memberQueries.list(), enabled });
  return (members.data ?? [])
    .filter((member) => member.active)
    .sort((a, b) => Number(b.role === 'engineer') - Number(a.role === 'engineer') || a.name.localeCompare(b.name))
    .map((member) => ({ memberId: member.id, name: member.name }));
}
