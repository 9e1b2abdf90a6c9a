import { FooterLink, PublicLayout } from '@/components/layouts/public-layout';
import { paths } from '@/config/paths';
import { RedirectIfSignedIn } from '@/lib/auth';
import { SignInForm } from '@/features/auth/components/sign-in-form';

export function SignInPage() {
  return (
    <RedirectIfSignedIn>
      <PublicLayout
        title="Sign in"
        intro="Vans, kits, stock and jobs for your heating firm."
        footer={<FooterLink to={paths.signUp.getHref()}>New here? Create a firm</FooterLink>}
      >
        <SignInForm />
      </PublicLayout>
    </RedirectIfSignedIn>
  );
}
