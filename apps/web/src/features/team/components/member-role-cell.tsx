import { useState } from 'react';
import { subject } from '@casl/ability';
import { roleLabels, roles, type Member, type Role } from '@heatfleet/domain';
import { useAbility } from '@/lib/ability';
import { useUpdateMember } from '@/features/team/api/use-update-member';
import { ChangeRoleDialog } from '@/features/team/components/change-role-dialog';
import { DeactivateDialog } from '@/features/team/components/deactivate-dialog';

interface MemberCellProps {
  member: Member;
  firmId: number;
  isYou: boolean;
}

function asSubject(member: Member, firmId: number, role: Role = member.role) {
  return subject('Member', { firmId, userId: member.userId, role, active: member.active });
}

export function MemberRoleCell({ member, firmId, isYou }: MemberCellProps) {
  const ability = useAbility();
  const update = useUpdateMember();
  const [open, setOpen] = useState(false);
  // Changing your own role could lock you out of this very screen; another Owner or Admin does it.
  const canChange = !isYou && ability.can('update', asSubject(member, firmId));
  if (!canChange) return <span>{roleLabels[member.role]}</span>;

  // Offer only the roles the rules allow the member to end up with (an Admin never makes an Owner).
  const allowed = roles.filter(
    (role) => role === member.role || ability.can('update', asSubject(member, firmId, role)),
  );

  return (
    <div className="flex flex-wrap items-center gap-x-3 gap-y-1 max-sm:justify-end">
      <span>{roleLabels[member.role]}</span>
      <button
        type="button"
        onClick={() => {
          update.reset();
          setOpen(true);
        }}
        className="min-h-12 rounded-md border border-line-strong bg-card px-3 font-semibold text-brand-700 hover:bg-brand-50"
      >
        Change role<span className="sr-only"> for {member.name}</span>
      </button>
      {open ? (
        <ChangeRoleDialog
          member={member}
          roles={allowed}
          busy={update.isPending}
          error={update.isError ? update.error.message : undefined}
          onClose={() => setOpen(false)}
          onConfirm={(role) => update.mutate({ id: member.id, role }, { onSuccess: () => setOpen(false) })}
        />
      ) : null}
    </div>
  );
}

export function MemberStatusAction({ member, firmId, isYou }: MemberCellProps) {
  const ability = useAbility();
  const update = useUpdateMember();
  const [confirming, setConfirming] = useState(false);
  if (isYou || !ability.can('update', asSubject(member, firmId))) return null;

  return (
    <div className="flex flex-col items-end gap-1 max-sm:w-full max-sm:items-stretch">
      <button
        type="button"
        disabled={update.isPending}
        onClick={() => {
          update.reset();
          // Deactivating signs someone out, so it asks first; reactivating is harmless and happens at once.
          if (member.active) setConfirming(true);
          else update.mutate({ id: member.id, active: true });
        }}
        className={`min-h-12 rounded-md border px-3 font-semibold disabled:opacity-60 ${
          member.active
            ? 'border-danger-700 text-danger-700 hover:bg-danger-50'
            : 'border-brand-600 text-brand-700 hover:bg-brand-50'
        }`}
      >
        {member.active ? 'Deactivate' : 'Reactivate'}
        <span className="sr-only"> {member.name}</span>
      </button>
      {confirming ? (
        <DeactivateDialog
          member={member}
          busy={update.isPending}
          error={update.isError ? update.error.message : undefined}
          onClose={() => setConfirming(false)}
          onConfirm={() => update.mutate({ id: member.id, active: false }, { onSuccess: () => setConfirming(false) })}
        />
      ) : null}
      {update.isError && !confirming ? (
        <p role="alert" className="text-sm font-semibold text-danger-700">
          {update.error.message}
        </p>
      ) : null}
    </div>
  );
}
