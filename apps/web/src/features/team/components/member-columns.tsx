import { roleLabels, type Member } from '@heatfleet/domain';
import { createDataTableColumnHelper, type DataTableColumns } from '@/components/ui/data-table-columns';
import { formatDate } from '@/lib/format';
import { MemberRoleCell, MemberStatusAction } from '@/features/team/components/member-role-cell';

const helper = createDataTableColumnHelper<Member>();

interface MemberColumnsContext {
  firmId: number;
  timeZone: string;
  currentUserId: number;
  /** Whether this person may change anyone at all; without it there is no actions column. */
  canManage: boolean;
}

export function buildMemberColumns({
  firmId,
  timeZone,
  currentUserId,
  canManage,
}: MemberColumnsContext): DataTableColumns<Member> {
  const columns = helper.columns([
    helper.accessor('name', {
      header: 'Name',
      sortFn: 'text',
      cell: (info) => (
        <span className="font-semibold">
          {info.getValue()}
          {info.row.original.userId === currentUserId ? (
            <span className="font-normal text-ink-muted"> (you)</span>
          ) : null}
        </span>
      ),
    }),
    helper.accessor('email', {
      header: 'E-mail',
      sortFn: 'text',
      cell: (info) => {
        // Let a long address break before the @ rather than mid-word on a phone.
        const [local, domain] = info.getValue().split(/(?=@)/);
        return domain ? (
          <>
            {local}
            <wbr />
            {domain}
          </>
        ) : (
          info.getValue()
        );
      },
    }),
    helper.accessor((member) => roleLabels[member.role], {
      id: 'role',
      header: 'Role',
      sortFn: 'text',
      cell: (info) => (
        <MemberRoleCell member={info.row.original} firmId={firmId} isYou={info.row.original.userId === currentUserId} />
      ),
    }),
    helper.accessor((member) => (member.active ? 'Active' : 'Deactivated'), {
      id: 'status',
      header: 'Status',
      sortFn: 'text',
      cell: (info) => (
        <span
          className={`rounded-full px-2 py-0.5 text-sm font-semibold ${
            info.row.original.active ? 'bg-ok-50 text-ok-700' : 'bg-danger-50 text-danger-700'
          }`}
        >
          {info.getValue()}
        </span>
      ),
    }),
    helper.accessor('joinedAt', {
      header: 'Joined',
      sortFn: 'basic',
      enableGlobalFilter: false,
      cell: (info) => <span className="whitespace-nowrap">{formatDate(info.getValue(), timeZone)}</span>,
    }),
  ]);
  if (!canManage) return columns;

  return [
    ...columns,
    helper.display({
      id: 'actions',
      header: () => <span className="sr-only">Actions</span>,
      meta: { hideCellLabel: true },
      cell: (info) => (
        <MemberStatusAction
          member={info.row.original}
          firmId={firmId}
          isYou={info.row.original.userId === currentUserId}
        />
      ),
    }),
  ];
}
