import { useId } from 'react';
import type { Me } from '@heatfleet/domain';
import { useSetActiveFirm } from '@/features/firms/api/use-set-active-firm';

/** Shown only to people in more than one firm; a change reloads every screen for the chosen firm. */
export function FirmSwitcher({ me }: { me: Me }) {
  const id = useId();
  const setActiveFirm = useSetActiveFirm();
  if (me.memberships.length < 2) return null;

  return (
    <div className="flex min-w-0 items-center gap-2">
      <label htmlFor={id} className="shrink-0 text-sm font-semibold text-brand-100">
        Firm
      </label>
      <select
        id={id}
        value={String(me.activeFirm.id)}
        disabled={setActiveFirm.isPending}
        onChange={(event) => setActiveFirm.mutate(Number(event.target.value))}
        className="min-h-12 w-full min-w-0 max-w-56 truncate rounded-md border border-brand-600 bg-brand-800 px-2 text-base text-white"
      >
        {me.memberships.map((membership) => (
          <option key={membership.firmId} value={membership.firmId}>
            {membership.firmName}
          </option>
        ))}
      </select>
      {setActiveFirm.isError ? (
        <span role="alert" className="text-sm text-ember-400">
          {setActiveFirm.error.message}
        </span>
      ) : null}
    </div>
  );
}
