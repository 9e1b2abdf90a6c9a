import { useQuery } from '@tanstack/react-query';
import { roleLabels, type Invitation } from '@heatfleet/domain';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { formatDate } from '@/lib/format';
import { invitationQueries } from '@/features/team/api/invitation-queries';
import { useWithdrawInvitation } from '@/features/team/api/use-withdraw-invitation';

function PendingInvitation({ invitation, timeZone }: { invitation: Invitation; timeZone: string }) {
  const withdraw = useWithdrawInvitation();
  return (
    <li className="flex flex-wrap items-center justify-between gap-3 py-3">
      <div className="min-w-0">
        <p className="font-semibold [overflow-wrap:anywhere]">{invitation.email}</p>
        <p className="text-sm text-ink-muted">
          {roleLabels[invitation.role]} · invited by {invitation.invitedBy} · expires{' '}
          {formatDate(invitation.expiresAt, timeZone)}
        </p>
        {withdraw.isError ? (
          <p role="alert" className="text-sm font-semibold text-danger-700">
            {withdraw.error.message}
          </p>
        ) : null}
      </div>
      <button
        type="button"
        disabled={withdraw.isPending}
        onClick={() => withdraw.mutate(invitation.id)}
        className="min-h-12 rounded-md border border-danger-700 px-3 font-semibold text-danger-700 hover:bg-danger-50 disabled:opacity-60"
      >
        Withdraw<span className="sr-only"> the invitation to {invitation.email}</span>
      </button>
    </li>
  );
}

export function PendingInvitations({ timeZone }: { timeZone: string }) {
  const invitations = useQuery(invitationQueries.pending());
  if (invitations.isPending) return <PageSpinner label="Loading invitations…" />;
  if (invitations.isError)
    return <QueryErrorNotice error={invitations.error} onRetry={() => void invitations.refetch()} />;
  if (invitations.data.length === 0) return <p className="text-ink-muted">No invitations are waiting for an answer.</p>;

  return (
    <ul className="divide-y divide-line" aria-label="Pending invitations">
      {invitations.data.map((invitation) => (
        <PendingInvitation key={invitation.id} invitation={invitation} timeZone={timeZone} />
      ))}
    </ul>
  );
}
