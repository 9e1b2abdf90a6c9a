import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { Can } from '@/lib/ability';
import { useSignedInMe } from '@/lib/auth';
import { RemindersTable } from '@/features/reminders/components/reminders-table';
import { RunScanButton } from '@/features/reminders/components/run-scan-button';

export function RemindersPage() {
  const me = useSignedInMe();
  return (
    <>
      <PageHeader title="Reminders">
        What Heatfleet has e-mailed about inspections, MOTs and services, to whom and when.
      </PageHeader>
      <div className="space-y-5">
        <Can I="update" a="ReminderSettings">
          <RunScanButton />
        </Can>
        <Card title="Sent">
          <RemindersTable timeZone={me.activeFirm.timeZone} />
        </Card>
      </div>
    </>
  );
}
