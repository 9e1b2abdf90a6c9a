import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { useParams } from 'react-router-dom';
import { EXPRESS_REQUEST_WORDS, tokenSchema, type PublicQuote } from '@heatfleet/domain';
import { PublicLayout } from '@/components/layouts/public-layout';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { TextField } from '@/components/ui/text-field';
import { isApiError } from '@/lib/api-client';
import { quoteLinkQueries, quotePdfHref, useAnswerQuote } from '@/features/money/api/quote-link-queries';
import { MoneyLinesTable } from '@/features/money/components/money-lines-table';

// A public page: the link in the quote e-mail (/q/<token>) leads here. The customer reads the quote, its
// cancellation information and the model cancellation form (Consumer Contracts Regulations 2013, Schedule 3),
// and accepts with their name and a tick (asking, if they want, for the work within the cancellation period), or
// declines. Opening the page changes nothing.

function Answer({ token, quote }: { token: string; quote: PublicQuote }) {
  const { accept, decline } = useAnswerQuote(token);
  const [name, setName] = useState('');
  const [agree, setAgree] = useState(false);
  const [express, setExpress] = useState(false);
  const error = accept.error ?? decline.error;
  return (
    <form
      className="space-y-4"
      onSubmit={(e) => {
        e.preventDefault();
        accept.mutate({ name, agree: agree as true, expressRequest: express });
      }}
    >
      <TextField
        label="Your name"
        name="name"
        value={name}
        onChange={(e) => setName(e.target.value)}
        autoComplete="name"
      />
      <label className="flex min-h-12 items-start gap-3">
        <input type="checkbox" className="mt-1 h-6 w-6" checked={agree} onChange={(e) => setAgree(e.target.checked)} />
        <span>I accept quote {quote.number} for the work and prices above.</span>
      </label>
      <label className="flex min-h-12 items-start gap-3">
        <input
          type="checkbox"
          className="mt-1 h-6 w-6"
          checked={express}
          onChange={(e) => setExpress(e.target.checked)}
        />
        <span>{EXPRESS_REQUEST_WORDS} (optional)</span>
      </label>
      {error ? (
        <p role="alert" className="font-semibold text-danger-700">
          {error.message}
        </p>
      ) : null}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" className="min-h-12" busy={accept.isPending}>
          Accept the quote
        </Button>
        <Button
          type="button"
          variant="secondary"
          className="min-h-12"
          busy={decline.isPending}
          onClick={() => decline.mutate('')}
        >
          Decline
        </Button>
      </div>
    </form>
  );
}

function QuoteLink({ token }: { token: string }) {
  const quote = useQuery(quoteLinkQueries.byToken(token));
  if (quote.isPending) return <PageSpinner label="Opening the quote…" />;
  if (quote.isError) {
    if (isApiError(quote.error, 404))
      return (
        <Alert tone="error" title="This link has expired or is not recognised">
          Ask the firm that sent it to send the quote again.
        </Alert>
      );
    return <QueryErrorNotice error={quote.error} onRetry={() => void quote.refetch()} />;
  }
  const q = quote.data;
  return (
    <div className="space-y-5">
      <div>
        <p className="text-lg font-semibold">{q.firmName}</p>
        {q.firmAddress ? <p>{q.firmAddress}</p> : null}
        {q.firmPhone || q.firmEmail ? <p>{[q.firmPhone, q.firmEmail].filter(Boolean).join(' · ')}</p> : null}
        {q.vatNumber ? <p>VAT registration number {q.vatNumber}</p> : null}
      </div>
      <p>
        Quote <strong>{q.number}</strong> for {q.customerName}, {q.siteAddress}. Valid until {q.validUntil}.
      </p>
      <MoneyLinesTable doc={q} />
      {q.notes ? <p>{q.notes}</p> : null}
      <a className="inline-flex min-h-12 items-center underline" href={quotePdfHref(token)}>
        Download the quote (PDF)
      </a>
      {q.status === 'accepted' && q.acceptance ? (
        <Alert tone="success" title="Thank you: the quote is accepted">
          Accepted by {q.acceptance.name}.{' '}
          {q.acceptance.expressRequest
            ? 'You asked for the work to be done within the cancellation period.'
            : 'The work will not start within the 14-day cancellation period unless you ask.'}
        </Alert>
      ) : q.status === 'declined' ? (
        <Alert tone="info" title="You declined this quote">
          {q.firmName} has been told.
        </Alert>
      ) : q.expired ? (
        <Alert tone="error" title="This quote has expired">
          Ask {q.firmName} for a new one.
        </Alert>
      ) : (
        <Answer token={token} quote={q} />
      )}
      <section className="space-y-2 text-sm">
        <h2 className="text-base font-semibold">Your right to cancel</h2>
        {q.cancellation.information.map((p, i) => (
          <p key={i}>{p}</p>
        ))}
        <h2 className="pt-2 text-base font-semibold">Model cancellation form</h2>
        {q.cancellation.modelForm.map((p, i) => (
          <p key={i}>{p}</p>
        ))}
      </section>
    </div>
  );
}

export function QuoteLinkPage() {
  const { token = '' } = useParams();
  const valid = tokenSchema.safeParse(token);
  return (
    <PublicLayout title="Your quote">
      {valid.success ? (
        <QuoteLink token={valid.data} />
      ) : (
        <Alert tone="error">{valid.error.issues[0]?.message ?? 'The link is not valid.'}</Alert>
      )}
    </PublicLayout>
  );
}
