import { Link, useParams } from 'react-router-dom';
import { paths } from '@/config/paths';
import { OutboxMessageView } from '@/features/outbox/components/outbox-message-view';

export function OutboxMessagePage() {
  const { id = '' } = useParams();
  return (
    <div className="space-y-4">
      <Link
        to={paths.outbox.getHref()}
        className="inline-flex min-h-12 items-center font-semibold text-brand-700 underline-offset-4 hover:underline"
      >
        ← All caught e-mails
      </Link>
      <OutboxMessageView id={id} />
    </div>
  );
}
