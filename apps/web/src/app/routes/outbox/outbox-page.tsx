import { PageHeader } from '@/components/ui/page-header';
import { OutboxList } from '@/features/outbox/components/outbox-list';

export function OutboxPage() {
  return (
    <>
      <PageHeader title="Outbox">
        E-mails Heatfleet sent here, caught by the local mail server and never delivered. Newest first.
      </PageHeader>
      <OutboxList />
    </>
  );
}
