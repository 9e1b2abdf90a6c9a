import { FooterLink, PublicLayout } from '@/components/layouts/public-layout';
import { paths } from '@/config/paths';
import { RedirectIfSignedIn } from '@/lib/auth';
import { SignUpForm } from '@/features/auth/components/sign-up-form';

export function SignUpPage() {
  return (
    <RedirectIfSignedIn>
      <PublicLayout
        title="Create a firm"
        intro="You become the firm's Owner and can invite the office, stores and engineers."
        footer={<FooterLink to={paths.signIn.getHref()}>Already have an account? Sign in</FooterLink>}
      >
        <SignUpForm />
      </PublicLayout>
    </RedirectIfSignedIn>
  );
}
