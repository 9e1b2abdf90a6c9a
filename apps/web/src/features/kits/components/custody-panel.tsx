import { useEffect, useRef, useState } from 'react';
import type { KitItem, LocationRef } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { useAbility } from '@/lib/ability';
import { shortTime } from '@/lib/offline/outbox-actions';
import { usePendingCustody } from '@/features/kits/api/use-custody';
import { CheckInForm } from '@/features/kits/components/check-in-form';
import { CheckOutForm } from '@/features/kits/components/check-out-form';
import {
  canHandleVan,
  type CustodyDepot,
  type CustodyFinish,
  type CustodyTargets,
  type CustodyVan,
} from '@/features/kits/components/custody-shared';
import { LocationText } from '@/features/kits/components/location-text';
import { MoveForm } from '@/features/kits/components/move-form';

interface CustodyPanelProps {
  firmId: number;
  targets: CustodyTargets;
  /** Where it is now, from the custody log. */
  location: LocationRef | null;
  vans: CustodyVan[];
  depots: CustodyDepot[];
  items: KitItem[];
}

type Open = 'check-out' | 'check-in' | 'move' | null;

const bigButton = 'min-h-14 w-full text-lg sm:w-auto sm:min-w-44';

/**
 * The actions first, as large buttons, because a phone that has just scanned a label is here to
 * check something out or in. Only what this member may do is offered.
 */
export function CustodyPanel({ firmId, targets, location: recorded, vans, depots, items }: CustodyPanelProps) {
  const ability = useAbility();
  const [open, setOpen] = useState<Open>(null);
  const [done, setDone] = useState<{ message: string; final: boolean } | null>(null);
  const doneRef = useRef<HTMLDivElement>(null);
  // Writes still on the phone move the kit ahead of the server: the next action starts from where it will be.
  const pending = usePendingCustody({ kitId: targets.kit?.id ?? null, itemId: targets.item?.id ?? null });
  const waiting = pending.filter((write) => write.state === 'waiting');
  const location = waiting.length > 0 ? (waiting.at(-1)!.meta.to ?? recorded) : recorded;

  useEffect(() => {
    if (done) doneRef.current?.focus();
  }, [done]);

  const onVan = location?.kind === 'van' ? vans.find((van) => van.id === location.id) : undefined;
  const outTargets = location?.kind === 'van' ? [] : vans.filter((van) => canHandleVan(ability, firmId, van));
  const mayHandleCurrent = onVan ? canHandleVan(ability, firmId, onVan) : false;
  const moveTargets = mayHandleCurrent ? vans.filter((van) => van.id !== onVan?.id) : [];

  const start = (what: Open) => {
    setDone(null);
    setOpen(what);
  };
  const finish: CustodyFinish = (message, whenSent) => {
    setOpen(null);
    setDone({ message, final: !whenSent });
    void whenSent?.then((sent) => {
      if (sent) setDone((shown) => (shown?.message === message ? { message: sent, final: true } : shown));
    });
  };
  const cancel = () => setOpen(null);

  return (
    <section aria-label="Custody" className="space-y-3 rounded-xl border border-line bg-card p-4 shadow-sm">
      <p>
        <span className="font-semibold">Now: </span>
        <LocationText location={location} />
        {waiting.length > 0 ? <span className="text-ink-muted"> (waiting to send)</span> : null}
      </p>
      {done ? (
        <div ref={doneRef} tabIndex={-1}>
          <Alert tone={done.final ? 'success' : 'info'}>{done.message}</Alert>
        </div>
      ) : null}
      {pending.length > 0 ? (
        <ul aria-label="Custody waiting to send" className="space-y-1 text-sm">
          {pending.map((write) => (
            <li key={write.id} className={write.state === 'attention' ? 'text-danger-700' : 'text-ink-muted'}>
              {write.label}, done at {shortTime(write.tappedAt)}:{' '}
              {write.state === 'attention'
                ? `refused: ${write.problem?.message ?? 'see Needs your attention'}`
                : 'waiting to send'}
            </li>
          ))}
        </ul>
      ) : null}
      {open === null ? (
        <div className="flex flex-col gap-2 sm:flex-row">
          {outTargets.length > 0 ? (
            <Button className={bigButton} onClick={() => start('check-out')}>
              Check out
            </Button>
          ) : null}
          {mayHandleCurrent ? (
            <Button className={bigButton} onClick={() => start('check-in')}>
              Check in
            </Button>
          ) : null}
          {moveTargets.length > 0 ? (
            <Button variant="secondary" className={bigButton} onClick={() => start('move')}>
              Move to another van
            </Button>
          ) : null}
          {outTargets.length === 0 && !mayHandleCurrent ? (
            <p className="text-ink-muted">
              {location?.kind === 'van'
                ? 'It is on another van: its engineer or the stores can check it in or move it.'
                : 'Stores, the office or an engineer with a van can check it out.'}
            </p>
          ) : null}
        </div>
      ) : null}
      {open === 'check-out' ? (
        <CheckOutForm targets={targets} vans={outTargets} items={items} onDone={finish} onCancel={cancel} />
      ) : null}
      {open === 'check-in' ? (
        <CheckInForm targets={targets} depots={depots} items={items} onDone={finish} onCancel={cancel} />
      ) : null}
      {open === 'move' ? <MoveForm targets={targets} vans={moveTargets} onDone={finish} onCancel={cancel} /> : null}
    </section>
  );
}
