import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';

export function QueryErrorNotice({ error, onRetry }: { error: Error; onRetry?: () => void }) {
  return (
    <div className="space-y-3 py-4">
      <Alert tone="error" title="This could not be loaded.">
        {error.message}
      </Alert>
      {onRetry ? (
        <Button variant="secondary" onClick={onRetry}>
          Try again
        </Button>
      ) : null}
    </div>
  );
}
