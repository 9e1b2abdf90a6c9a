import { useEffect, useId, useRef, useState } from 'react';
import { roleLabels, roleSummaries, type Member, type Role } from '@heatfleet/domain';
import { Button } from '@/components/ui/button';
import { ChoiceGroup } from '@/components/ui/choice-group';

interface ChangeRoleDialogProps {
  member: Member;
  /** The roles the signed-in person may give this member (the current one included). */
  roles: Role[];
  busy: boolean;
  error: string | undefined;
  onConfirm: (role: Role) => void;
  onClose: () => void;
}

/**
 * Changing a role is a choice and then a confirm naming what changes, so one slip on a list of members cannot
 * demote someone (issue 14). A modal <dialog> keeps focus inside and Escape closes it.
 */
export function ChangeRoleDialog({ member, roles, busy, error, onConfirm, onClose }: ChangeRoleDialogProps) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  const [role, setRole] = useState<Role>(member.role);
  useEffect(() => {
    const dialog = ref.current;
    if (dialog && !dialog.open) dialog.showModal();
    return () => dialog?.close();
  }, []);
  const changed = role !== member.role;
  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      onClose={onClose}
      className="m-auto w-[min(32rem,calc(100vw-2rem))] rounded-lg bg-card p-5 text-ink shadow-xl backdrop:bg-ink/60"
    >
      <form
        method="dialog"
        className="space-y-4"
        onSubmit={(event) => {
          event.preventDefault();
          if (changed) onConfirm(role);
        }}
      >
        <h2 id={titleId} className="text-lg font-bold">
          Change {member.name}’s role
        </h2>
        <p>
          Now: <strong>{roleLabels[member.role]}</strong>. {roleSummaries[member.role]}
        </p>
        <ChoiceGroup
          legend="New role"
          name="role"
          columns={2}
          value={role}
          onChange={(value) => setRole(value as Role)}
          options={roles.map((r) => ({ value: r, label: roleLabels[r], hint: roleSummaries[r] }))}
        />
        {changed ? (
          <p className="font-semibold" aria-live="polite">
            {member.name} changes from {roleLabels[member.role]} to {roleLabels[role]} at once, on every device.
          </p>
        ) : null}
        {error ? (
          <p role="alert" className="font-semibold text-danger-700">
            {error}
          </p>
        ) : null}
        <div className="flex flex-col-reverse gap-2 sm:flex-row sm:justify-end">
          <Button variant="secondary" className="min-h-12" onClick={onClose}>
            Keep as {roleLabels[member.role]}
          </Button>
          <Button type="submit" className="min-h-12" disabled={!changed} busy={busy}>
            {changed ? `Make ${roleLabels[role]}` : 'Choose a new role'}
          </Button>
        </div>
      </form>
    </dialog>
  );
}
