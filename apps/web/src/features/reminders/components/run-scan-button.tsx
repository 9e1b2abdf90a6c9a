import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { useRunReminderScan } from '@/features/reminders/api/use-reminder-actions';

/** Runs today's check now instead of waiting for the set hour; anything already reminded is not sent again. */
export function RunScanButton() {
  const scan = useRunReminderScan();
  return (
    <div className="space-y-2">
      <Button variant="secondary" busy={scan.isPending} onClick={() => scan.mutate()}>
        Check for reminders now
      </Button>
      {scan.isSuccess ? (
        <Alert tone="success">
          {scan.data === 0
            ? 'Nothing new to remind anyone of.'
            : `${scan.data} reminder e-mail${scan.data === 1 ? '' : 's'} sent.`}
        </Alert>
      ) : null}
      {scan.isError ? <Alert tone="error">{scan.error.message}</Alert> : null}
    </div>
  );
}
