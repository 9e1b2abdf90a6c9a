import { Alert } from '@/components/ui/alert';

/** What became of the last save of a section: the API's own message on failure, a short note on success. */
export function SaveFeedback({ error, saved }: { error: Error | null; saved: boolean }) {
  if (error) return <Alert tone="error">{error.message}</Alert>;
  if (saved)
    return (
      <p role="status" className="font-semibold text-ok-700">
        Saved.
      </p>
    );
  return null;
}
