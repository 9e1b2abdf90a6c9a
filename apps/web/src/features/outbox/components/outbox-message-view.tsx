import { Fragment } from 'react';
import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { formatDateTime } from '@/lib/format';
import { outboxQueries } from '@/features/outbox/api/outbox-queries';

const LOCAL_TIME_ZONE = Intl.DateTimeFormat().resolvedOptions().timeZone;
const URL_PATTERN = /(https?:\/\/[^\s<>"')\]]+)/g;

function parseUrl(href: string): URL | null {
  try {
    return new URL(href);
  } catch {
    return null;
  }
}

/** A link back into Heatfleet opens in place, keeping this browser's session; others open normally. */
function MailLink({ href }: { href: string }) {
  const url = parseUrl(href);
  const className = 'font-semibold text-brand-700 underline underline-offset-4 [overflow-wrap:anywhere]';
  if (url && url.origin === window.location.origin) {
    return (
      <Link to={url.pathname + url.search + url.hash} className={className}>
        {href}
      </Link>
    );
  }
  return (
    <a href={href} className={className} rel="noreferrer noopener" target="_blank">
      {href}
    </a>
  );
}

function MailText({ text }: { text: string }) {
  const parts = text.split(URL_PATTERN);
  return (
    <div className="whitespace-pre-wrap break-words rounded-lg border border-line bg-canvas p-4 [overflow-wrap:anywhere]">
      {parts.map((part, index) => (
        // split() with a capture group puts every URL at an odd index.
        <Fragment key={index}>{index % 2 === 1 ? <MailLink href={part} /> : part}</Fragment>
      ))}
    </div>
  );
}

export function OutboxMessageView({ id }: { id: string }) {
  const message = useQuery(outboxQueries.detail(id));
  if (message.isPending) return <PageSpinner label="Opening the e-mail…" />;
  if (message.isError) return <QueryErrorNotice error={message.error} onRetry={() => void message.refetch()} />;
  const mail = message.data;

  return (
    <article className="space-y-4">
      <h1 className="text-2xl font-bold text-brand-900 [overflow-wrap:anywhere]">{mail.subject || '(no subject)'}</h1>
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
        <dt className="font-semibold text-ink-muted">From</dt>
        <dd className="[overflow-wrap:anywhere]">{mail.from}</dd>
        <dt className="font-semibold text-ink-muted">To</dt>
        <dd className="[overflow-wrap:anywhere]">{mail.to.join(', ')}</dd>
        <dt className="font-semibold text-ink-muted">Received</dt>
        <dd>{formatDateTime(mail.receivedAt, LOCAL_TIME_ZONE)}</dd>
      </dl>
      <MailText text={mail.text} />
      {mail.links.length > 0 ? (
        <section className="space-y-2">
          <h2 className="font-bold">Links in this e-mail</h2>
          <ul className="space-y-2">
            {mail.links.map((link) => (
              <li key={link}>
                <MailLink href={link} />
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </article>
  );
}
