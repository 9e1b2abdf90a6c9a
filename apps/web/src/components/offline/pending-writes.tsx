import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import type { QueuedWrite } from '@/lib/offline/outbox';
import { discardWrite, retryWrite, shortTime } from '@/lib/offline/outbox-actions';

/**
 * What the server refused after the phone sent it later: each with the server's own message, to open where it was
 * made (its draft is there again), send again once put right, or drop.
 */
export function AttentionList({ writes }: { writes: QueuedWrite[] }) {
  return (
    <section aria-labelledby="needs-attention" className="space-y-2">
      <h2 id="needs-attention" className="font-semibold text-ink">
        Needs your attention
      </h2>
      <ul aria-label="Needs your attention" className="space-y-2">
        {writes.map((write) => (
          <li key={write.id} className="rounded-md border-l-4 border-danger-700 bg-danger-50 px-3 py-2 text-ink">
            <p className="font-semibold">{write.label}</p>
            <p className="text-sm text-ink-muted">
              Done at {shortTime(write.tappedAt)} in {write.firmName}; refused when sent
              {write.problem ? ` at ${shortTime(write.problem.at)}` : ''}.
            </p>
            {write.problem ? <p className="text-danger-700">{write.problem.message}</p> : null}
            <div className="mt-2 flex flex-wrap gap-2">
              {write.href ? (
                <Link
                  to={write.href}
                  className="inline-flex min-h-12 items-center font-semibold text-brand-700 underline"
                >
                  Open
                </Link>
              ) : null}
              <Button variant="secondary" onClick={() => void retryWrite(write)}>
                Send again
              </Button>
              <Button variant="danger" onClick={() => void discardWrite(write)}>
                Discard
              </Button>
            </div>
          </li>
        ))}
      </ul>
    </section>
  );
}

/** What is on the phone waiting to go, oldest first, with when each was done. */
export function WaitingList({ writes, activeFirmId }: { writes: QueuedWrite[]; activeFirmId: number }) {
  return (
    <section aria-labelledby="waiting-to-send" className="space-y-2">
      <h2 id="waiting-to-send" className="font-semibold text-ink">
        Waiting to send
      </h2>
      <ul aria-label="Waiting to send" className="space-y-1">
        {writes.map((write) => (
          <li key={write.id} className="text-ink">
            {write.label}
            <span className="text-sm text-ink-muted">
              {' '}
              (done at {shortTime(write.tappedAt)}
              {write.firmId !== activeFirmId ? `; waits until you switch to ${write.firmName}` : ''})
            </span>
          </li>
        ))}
      </ul>
    </section>
  );
}
