import type { SlotStatus } from '@/features/jobs/api/autosave-store';

/**
 * Beside each self-saving field: whether what is shown is saved. A failed save says why and offers
 * to send again; nothing is lost meanwhile (the figures stay in the boxes).
 */
export function SavedMark({
  status,
  stored,
  kept = false,
  failure,
  incompleteWords = 'Not saved yet',
  onRetry,
}: {
  status: SlotStatus;
  stored: boolean;
  /** Kept in the phone's queue, waiting for signal. */
  kept?: boolean;
  failure: string | null;
  incompleteWords?: string;
  onRetry: () => void;
}) {
  if (status === 'failed') {
    return (
      <span role="alert" className="flex flex-wrap items-center gap-2 font-semibold text-danger-700">
        Not saved: {failure}
        <button
          type="button"
          onClick={onRetry}
          className="min-h-12 rounded-md border-2 border-danger-700 bg-card px-3 font-semibold text-danger-700"
        >
          Try again
        </button>
      </span>
    );
  }
  const [text, tone] =
    status === 'pending' || status === 'saving'
      ? ['Saving…', 'text-ink-muted']
      : status === 'incomplete'
        ? [incompleteWords, 'text-ember-700']
        : status === 'invalid'
          ? ['Not saved: see the figure', 'text-danger-700']
          : stored && kept
            ? ['✓ Saved on this phone', 'text-ok-700']
            : stored
              ? ['✓ Saved', 'text-ok-700']
              : ['', ''];
  return (
    <span role="status" className={`text-sm font-semibold ${tone}`}>
      {text}
    </span>
  );
}
