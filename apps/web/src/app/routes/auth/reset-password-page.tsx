import { FooterLink, PublicLayout } from '@/components/layouts/public-layout';
import { paths } from '@/config/paths';
import { RedirectIfSignedIn } from '@/lib/auth';
import { ResetRequestForm } from '@/features/auth/components/reset-request-form';

export function ResetPasswordPage() {
  return (
    <RedirectIfSignedIn>
      <PublicLayout
        title="Forgotten password"
        intro="Give the e-mail you sign in with."
        footer={<FooterLink to={paths.signIn.getHref()}>Back to sign in</FooterLink>}
      >
        <ResetRequestForm />
      </PublicLayout>
    </RedirectIfSignedIn>
  );
}
