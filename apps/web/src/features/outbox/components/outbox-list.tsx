import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { paths } from '@/config/paths';
import { formatDateTime } from '@/lib/format';
import { outboxQueries } from '@/features/outbox/api/outbox-queries';

const LOCAL_TIME_ZONE = Intl.DateTimeFormat().resolvedOptions().timeZone;

export function OutboxList() {
  // Mail arrives a moment after the action that sends it (a background job), so keep looking.
  const messages = useQuery({ ...outboxQueries.list(), refetchInterval: 3000 });
  if (messages.isPending) return <PageSpinner label="Opening the outbox…" />;
  if (messages.isError) return <QueryErrorNotice error={messages.error} onRetry={() => void messages.refetch()} />;
  if (messages.data.length === 0) {
    return <p className="text-ink-muted">No e-mails caught yet. Invitations and password resets land here.</p>;
  }

  return (
    <ul className="divide-y divide-line rounded-xl border border-line bg-card" aria-label="Caught e-mails">
      {messages.data.map((message) => (
        <li key={message.id}>
          <Link to={paths.outboxMessage.getHref(message.id)} className="block min-h-12 px-4 py-3 hover:bg-brand-50">
            <span className="block font-semibold text-brand-800 [overflow-wrap:anywhere]">
              {message.subject || '(no subject)'}
            </span>
            <span className="block text-sm text-ink-muted [overflow-wrap:anywhere]">
              To {message.to.join(', ')} · {formatDateTime(message.receivedAt, LOCAL_TIME_ZONE)}
            </span>
          </Link>
        </li>
      ))}
    </ul>
  );
}
