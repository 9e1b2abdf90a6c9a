import { useMemo } from 'react';
import { useQuery } from '@tanstack/react-query';
import { DataTable } from '@/components/ui/data-table';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { useAbility } from '@/lib/ability';
import { memberQueries } from '@/features/team/api/member-queries';
import { buildMemberColumns } from '@/features/team/components/member-columns';

const initialSorting = [{ id: 'name', desc: false }];

export function MembersTable({
  firmId,
  timeZone,
  currentUserId,
}: {
  firmId: number;
  timeZone: string;
  currentUserId: number;
}) {
  const ability = useAbility();
  const canManage = ability.can('update', 'Member');
  const members = useQuery(memberQueries.list());
  const columns = useMemo(
    () => buildMemberColumns({ firmId, timeZone, currentUserId, canManage }),
    [firmId, timeZone, currentUserId, canManage],
  );

  if (members.isPending) return <PageSpinner label="Loading the team…" />;
  if (members.isError) return <QueryErrorNotice error={members.error} onRetry={() => void members.refetch()} />;

  return (
    <DataTable
      columns={columns}
      data={members.data}
      getRowId={(member) => String(member.id)}
      caption="Members of the firm"
      filterLabel="Find a member"
      itemsLabel="members"
      emptyMessage="No members yet."
      initialSorting={initialSorting}
    />
  );
}
