import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { FooterLink, PublicLayout } from '@/components/layouts/public-layout';
import { buttonClasses } from '@/components/ui/button';
import { paths } from '@/config/paths';
import { RedirectIfSignedIn } from '@/lib/auth';
import { SignUpForm } from '@/features/auth/components/sign-up-form';
import { outboxQueries } from '@/features/outbox/api/outbox-queries';

export function SignUpPage() {
  // Where the local mail catcher runs (npm start, tests), the e-mail waits in the Outbox; production has none.
  const outbox = useQuery({ ...outboxQueries.list(), staleTime: 5 * 60_000, retry: false });
  const outboxLink = outbox.isSuccess ? (
    <Link to={paths.outbox.getHref()} className={buttonClasses('primary', 'w-full')}>
      Open the Outbox (e-mails caught on this machine)
    </Link>
  ) : null;
  return (
    <RedirectIfSignedIn>
      <PublicLayout
        title="Create a firm"
        intro="We e-mail you a link to finish. You become the firm's Owner and can invite the office, stores and engineers."
        footer={<FooterLink to={paths.signIn.getHref()}>Already have an account? Sign in</FooterLink>}
      >
        <SignUpForm outboxLink={outboxLink} />
      </PublicLayout>
    </RedirectIfSignedIn>
  );
}
