import { useQuery } from '@tanstack/react-query';
import { useParams } from 'react-router-dom';
import { tokenSchema } from '@heatfleet/domain';
import { FooterLink, PublicLayout } from '@/components/layouts/public-layout';
import { Alert } from '@/components/ui/alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { paths } from '@/config/paths';
import { isApiError } from '@/lib/api-client';
import { sessionQueries } from '@/lib/auth';
import { invitationPreviewQueries } from '@/features/invitations/api/invitation-preview-queries';
import { AcceptInvitationForm } from '@/features/invitations/components/accept-invitation-form';

function Invitation({ token }: { token: string }) {
  const me = useQuery(sessionQueries.me());
  const preview = useQuery(invitationPreviewQueries.byToken(token));

  if (preview.isPending) return <PageSpinner label="Opening the invitation…" />;
  if (preview.isError) {
    if (isApiError(preview.error, 404)) {
      return (
        <Alert tone="error" title="This invitation can no longer be used">
          It may have been accepted already, withdrawn, or it has expired. Ask whoever invited you to send a new one.
        </Alert>
      );
    }
    return <QueryErrorNotice error={preview.error} onRetry={() => void preview.refetch()} />;
  }
  return <AcceptInvitationForm token={token} invitation={preview.data} signedInAs={me.data?.user.email ?? null} />;
}

export function AcceptInvitationPage() {
  const { token = '' } = useParams();
  const valid = tokenSchema.safeParse(token);
  return (
    <PublicLayout
      title="Join a firm on Heatfleet"
      footer={<FooterLink to={paths.signIn.getHref()}>Go to sign in</FooterLink>}
    >
      {valid.success ? (
        <Invitation token={valid.data} />
      ) : (
        <Alert tone="error">{valid.error.issues[0]?.message ?? 'The link is not valid.'}</Alert>
      )}
    </PublicLayout>
  );
}
