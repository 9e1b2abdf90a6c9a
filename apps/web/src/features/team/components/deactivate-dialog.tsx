import { useEffect, useId, useRef } from 'react';
import type { Member } from '@heatfleet/domain';
import { Button } from '@/components/ui/button';

interface DeactivateDialogProps {
  member: Member;
  busy: boolean;
  error: string | undefined;
  onConfirm: () => void;
  onClose: () => void;
}

/**
 * Deactivating someone signs them out of the firm on every device, so it asks first, naming who and what
 * happens; a stray tap on a list of members changes nothing. Reactivating needs no confirm. Escape cancels.
 */
export function DeactivateDialog({ member, busy, error, onConfirm, onClose }: DeactivateDialogProps) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  useEffect(() => {
    const dialog = ref.current;
    if (dialog && !dialog.open) dialog.showModal();
    return () => dialog?.close();
  }, []);
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
          onConfirm();
        }}
      >
        <h2 id={titleId} className="text-lg font-bold">
          Deactivate {member.name}?
        </h2>
        <p>
          {member.name} is signed out of this firm at once, on every device, and cannot sign in to it until reactivated.
          Their jobs, checks and stock records stay as they are.
        </p>
        {error ? (
          <p role="alert" className="font-semibold text-danger-700">
            {error}
          </p>
        ) : null}
        <div className="flex flex-col-reverse gap-2 sm:flex-row sm:justify-end">
          <Button variant="secondary" className="min-h-12" onClick={onClose}>
            Keep {member.name} active
          </Button>
          <Button type="submit" variant="danger" className="min-h-12" busy={busy}>
            Deactivate {member.name}
          </Button>
        </div>
      </form>
    </dialog>
  );
}
