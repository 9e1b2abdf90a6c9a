import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import type { Quote, QuoteStatus } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Badge, type BadgeTone } from '@/components/ui/badge';
import { Button, buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { useAbility } from '@/lib/ability';
import { sessionQueries } from '@/lib/auth';
import { formatCalendarDate, formatDateTime } from '@/lib/format';
import { quotePdfHrefFor, quoteQueries, useQuoteMutations } from '@/features/money/api/quote-queries';
import { MoneyLinesTable } from '@/features/money/components/money-lines-table';
import { QuoteLinesEditor } from '@/features/money/components/quote-lines-editor';
import { QuotePhoneAccept } from '@/features/money/components/quote-phone-accept';

// The job page's "Quote" section (issue 15; DEVELOPERS.md, "Money"): the newest quote for the job, made from the
// job's priced lines, its lines changed while it is a draft, e-mailed to the customer with a link, or accepted
// here on the phone with the customer's signature. Engineers, admins and owners may do each (the domain's CASL).

const statusLabels: Record<QuoteStatus, string> = {
  draft: 'Draft',
  sent: 'Sent',
  accepted: 'Accepted',
  declined: 'Declined',
};
const statusTones: Record<QuoteStatus, BadgeTone> = {
  draft: 'neutral',
  sent: 'warn',
  accepted: 'ok',
  declined: 'danger',
};

function QuoteState({ quote, timeZone }: { quote: Quote; timeZone: string }) {
  const a = quote.acceptance;
  return (
    <div className="space-y-1">
      <p className="flex flex-wrap items-center gap-2">
        <span>
          Quote <strong>{quote.number}</strong>, valid until {formatCalendarDate(quote.validUntil)}
        </span>
        <Badge tone={quote.expired && !a ? 'danger' : statusTones[quote.status]}>
          {quote.expired && !a && quote.status !== 'declined' ? 'Expired' : statusLabels[quote.status]}
        </Badge>
      </p>
      {quote.sentAt ? <p>E-mailed to the customer {formatDateTime(quote.sentAt, timeZone)}.</p> : null}
      {a ? (
        <Alert tone="success" title={`Accepted by ${a.name}`}>
          {formatDateTime(a.at, timeZone)}, {a.via === 'phone' ? 'on the phone' : 'by the e-mailed link'}
          {a.hasSignature ? ', signed' : ''}.{' '}
          {a.expressRequest
            ? 'The customer asked for the work to be done within the 14-day cancellation period.'
            : 'The customer did not ask for the work within the 14-day cancellation period: do not start it before then.'}
        </Alert>
      ) : null}
      {quote.status === 'declined' ? (
        <Alert tone="info" title="The customer declined this quote">
          {quote.declineReason ?? 'No reason given.'}
        </Alert>
      ) : null}
    </div>
  );
}

export function JobQuoteSection({ jobId }: { jobId: number }) {
  const me = useQuery(sessionQueries.me()).data;
  const ability = useAbility();
  const quotes = useQuery(quoteQueries.forJob(jobId));
  const { make, change, send, accept } = useQuoteMutations(jobId);
  const [editing, setEditing] = useState(false);
  const [taking, setTaking] = useState(false);
  if (!me) return null;
  const timeZone = me.activeFirm.timeZone;
  const canMake = ability.can('create', 'Quote');
  const canChange = ability.can('update', 'Quote');
  let body;
  if (quotes.isPending) body = <p>Loading the quote…</p>;
  else if (quotes.isError) body = <QueryErrorNotice error={quotes.error} onRetry={() => void quotes.refetch()} />;
  else {
    const quote = quotes.data[0];
    const open = quote && !quote.expired && (quote.status === 'draft' || quote.status === 'sent');
    const error = (make.error ?? change.error ?? send.error)?.message ?? null;
    body = (
      <div className="space-y-4">
        {quote ? <QuoteState quote={quote} timeZone={timeZone} /> : <p>No quote for this job yet.</p>}
        {quote && editing ? (
          <QuoteLinesEditor
            lines={quote.lines}
            vatRegistered={quote.vatRegistered}
            busy={change.isPending}
            onCancel={() => setEditing(false)}
            onSave={(lines) => change.mutate({ id: quote.id, lines }, { onSuccess: () => setEditing(false) })}
          />
        ) : quote ? (
          <MoneyLinesTable doc={quote} />
        ) : null}
        {error ? (
          <p role="alert" className="font-semibold text-danger-700">
            {error}
          </p>
        ) : null}
        {canMake && (!quote || quote.status === 'declined' || (quote.expired && !quote.acceptance)) ? (
          <Button className="min-h-12 w-full sm:w-auto" busy={make.isPending} onClick={() => make.mutate()}>
            {quote ? 'Make a new quote' : 'Make a quote'}
          </Button>
        ) : null}
        {quote && !editing ? (
          <div className="flex flex-col gap-3 sm:flex-row sm:flex-wrap">
            {canChange && open && quote.status === 'draft' ? (
              <Button variant="secondary" className="min-h-12 w-full sm:w-auto" onClick={() => setEditing(true)}>
                Change the lines
              </Button>
            ) : null}
            {canChange && open ? (
              <Button
                variant="secondary"
                className="min-h-12 w-full sm:w-auto"
                busy={send.isPending}
                onClick={() => send.mutate(quote.id)}
              >
                {quote.status === 'sent' ? 'E-mail it to the customer again' : 'E-mail it to the customer'}
              </Button>
            ) : null}
            <a
              className={buttonClasses('secondary', 'min-h-12 w-full sm:w-auto')}
              href={quotePdfHrefFor(quote.id)}
              download
            >
              Download the quote (PDF)
            </a>
            {canChange && open && !taking ? (
              <Button className="min-h-12 w-full sm:w-auto" onClick={() => setTaking(true)}>
                Customer accepts here
              </Button>
            ) : null}
          </div>
        ) : null}
        {quote && open && taking && !editing ? (
          <QuotePhoneAccept
            quote={quote}
            busy={accept.isPending}
            error={accept.error?.message ?? null}
            onAccept={(input) => accept.mutate({ id: quote.id, input }, { onSuccess: () => setTaking(false) })}
          />
        ) : null}
      </div>
    );
  }
  return <Card title="Quote">{body}</Card>;
}
