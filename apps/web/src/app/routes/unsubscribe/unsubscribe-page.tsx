import { useQuery } from '@tanstack/react-query';
import { useParams } from 'react-router-dom';
import { tokenSchema } from '@heatfleet/domain';
import { PublicLayout } from '@/components/layouts/public-layout';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { isApiError } from '@/lib/api-client';
import { unsubscribeQueries, useUnsubscribe } from '@/features/unsubscribe/api/unsubscribe-queries';

// A public page: the link in a firm's reminder e-mail leads here, and one button stops those e-mails (no sign-in).
// Opening the page changes nothing, so a mail scanner following the link does not unsubscribe anyone.

function Unsubscribe({ token }: { token: string }) {
  const preview = useQuery(unsubscribeQueries.byToken(token));
  const unsubscribe = useUnsubscribe(token);
  if (preview.isPending) return <PageSpinner label="Opening the link…" />;
  if (preview.isError) {
    if (isApiError(preview.error, 404))
      return (
        <Alert tone="error" title="This link is not recognised">
          Check that the whole link from the e-mail was opened, or reply to the firm that sent it and ask them to stop.
        </Alert>
      );
    return <QueryErrorNotice error={preview.error} onRetry={() => void preview.refetch()} />;
  }
  const { firmName, maskedEmail, unsubscribed } = preview.data;
  if (unsubscribed)
    return (
      <Alert tone="success" title="You are unsubscribed">
        {firmName} will not send reminder offers to {maskedEmail} again. E-mails about work you book, such as a visit
        report, still come.
      </Alert>
    );
  return (
    <div className="space-y-4">
      <p>
        Stop e-mails from <strong>{firmName}</strong> offering your heating system&rsquo;s yearly check, sent to{' '}
        <strong>{maskedEmail}</strong>?
      </p>
      <Button className="min-h-12 w-full" busy={unsubscribe.isPending} onClick={() => unsubscribe.mutate()}>
        Unsubscribe
      </Button>
      {unsubscribe.isError ? (
        <p role="alert" className="font-semibold text-danger-700">
          {unsubscribe.error.message}
        </p>
      ) : null}
    </div>
  );
}

export function UnsubscribePage() {
  const { token = '' } = useParams();
  const valid = tokenSchema.safeParse(token);
  return (
    <PublicLayout title="Unsubscribe">
      {valid.success ? (
        <Unsubscribe token={valid.data} />
      ) : (
        <Alert tone="error">{valid.error.issues[0]?.message ?? 'The link is not valid.'}</Alert>
      )}
    </PublicLayout>
  );
}
