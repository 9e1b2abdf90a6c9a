import { useId, useState, useSyncExternalStore } from 'react';
import { Link } from 'react-router-dom';
import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import type { Me } from '@heatfleet/domain';
import { AttentionList, WaitingList } from '@/components/offline/pending-writes';
import { paths } from '@/config/paths';
import { applyUpdate, useUpdateReady } from '@/lib/offline/app-update';
import { useOldestCachedAnswer } from '@/lib/offline/data-age';
import { useOutbox } from '@/lib/offline/outbox';
import { changesText, shortTime } from '@/lib/offline/outbox-actions';
import { useSenderState } from '@/lib/offline/outbox-sender';
import { useStorageAnswer } from '@/lib/offline/storage-persistence';
import { useOnline } from '@/lib/offline/use-online';

/** The oldest data on screen (the queries someone is looking at), for "as of" when there is no signal. */
function oldestShownData(client: QueryClient): number | null {
  let oldest: number | null = null;
  for (const query of client.getQueryCache().getAll()) {
    if (query.getObserversCount() === 0 || query.state.data === undefined || !query.state.dataUpdatedAt) continue;
    oldest = oldest === null ? query.state.dataUpdatedAt : Math.min(oldest, query.state.dataUpdatedAt);
  }
  return oldest;
}

function useOldestShownData(enabled: boolean): number | null {
  const client = useQueryClient();
  return useSyncExternalStore(
    (listener) => client.getQueryCache().subscribe(listener),
    () => (enabled ? oldestShownData(client) : null),
  );
}

const linkClass = 'font-semibold underline underline-offset-2';
// The phone's refusal to keep storage is told once per phone, not on every page.
const STORAGE_NOTED_KEY = 'heatfleet.storage-refusal-noted';

/**
 * Where things stand, always on screen: "Offline", "3 changes waiting to send" or "All saved"; data shown from the
 * phone's copy says how old it is; refused writes are one tap away; a new version is offered, never forced.
 */
export function OfflineStatus({ me }: { me: Me }) {
  const detailsId = useId();
  const [open, setOpen] = useState(false);
  const [storageNoted, setStorageNoted] = useState(() => localStorage.getItem(STORAGE_NOTED_KEY) === 'yes');
  const online = useOnline();
  const writes = useOutbox();
  const sender = useSenderState();
  const cachedAt = useOldestCachedAnswer();
  const shownAt = useOldestShownData(!online);
  const updateReady = useUpdateReady();
  const storage = useStorageAnswer();

  const waiting = writes.filter((write) => write.state === 'waiting');
  const attention = writes.filter((write) => write.state === 'attention');
  const otherFirm = waiting.filter((write) => write.firmId !== me.activeFirm.id);
  const here = waiting.length - otherFirm.length;
  const asOf = [cachedAt, shownAt].filter((at): at is number => at !== null);

  let headline: string;
  if (!online) headline = 'Offline';
  else if (sender.hold === 'signed-out' && here > 0) headline = `Sign in again to send ${changesText(here)}`;
  else if (here > 0)
    headline = sender.sending ? `Sending ${changesText(here)}…` : `${changesText(here)} waiting to send`;
  else headline = 'All saved';

  const notes: string[] = [];
  if (!online && here > 0) notes.push(`${changesText(here)} waiting to send`);
  if (asOf.length > 0 && (!online || cachedAt !== null))
    notes.push(`showing what was saved as of ${shortTime(Math.min(...asOf))}`);
  for (const firmName of new Set(otherFirm.map((write) => write.firmName))) {
    const count = otherFirm.filter((write) => write.firmName === firmName).length;
    notes.push(
      `${changesText(count)} for ${firmName} ${count === 1 ? 'waits' : 'wait'} until you switch to ${firmName}`,
    );
  }
  const tone = !online || attention.length > 0 ? 'bg-ember-100 text-ink' : 'bg-brand-50 text-brand-900';

  return (
    <div className={`print:hidden ${tone}`}>
      <div className="mx-auto flex max-w-5xl flex-wrap items-center gap-x-3 gap-y-1 px-4 py-1 text-sm">
        <p role="status" aria-label="Saving" className="min-w-0">
          <span className="font-semibold">{headline}</span>
          {notes.length > 0 ? <span> · {notes.join(' · ')}</span> : null}
        </p>
        {sender.hold === 'signed-out' && here > 0 ? (
          <Link to={paths.signIn.getHref(window.location.pathname)} className={linkClass}>
            Sign in
          </Link>
        ) : null}
        {attention.length > 0 || waiting.length > 0 ? (
          <button
            type="button"
            aria-expanded={open}
            aria-controls={detailsId}
            onClick={() => setOpen((was) => !was)}
            className={`min-h-12 ${linkClass} ${attention.length > 0 ? 'text-danger-700' : ''}`}
          >
            {attention.length > 0
              ? `${changesText(attention.length)} need${attention.length === 1 ? 's' : ''} your attention`
              : 'What is waiting'}
          </button>
        ) : null}
        {updateReady ? (
          <span className="flex items-center gap-2">
            A new version is ready: update when you are ready.
            <button type="button" onClick={applyUpdate} className={`min-h-12 ${linkClass}`}>
              Update now
            </button>
          </span>
        ) : null}
        {storage === 'refused' && !storageNoted ? (
          <span className="flex items-center gap-2 text-ink-muted">
            This phone did not agree to keep saved work for good: it may clear it when short of space.
            <button
              type="button"
              onClick={() => {
                localStorage.setItem(STORAGE_NOTED_KEY, 'yes');
                setStorageNoted(true);
              }}
              className={`min-h-12 ${linkClass}`}
            >
              OK
            </button>
          </span>
        ) : null}
      </div>
      {open && (attention.length > 0 || waiting.length > 0) ? (
        <div id={detailsId} className="mx-auto max-w-5xl space-y-3 px-4 pb-3">
          {attention.length > 0 ? <AttentionList writes={attention} /> : null}
          {waiting.length > 0 ? <WaitingList writes={waiting} activeFirmId={me.activeFirm.id} /> : null}
        </div>
      ) : null}
    </div>
  );
}
