import { useQuery } from '@tanstack/react-query';
import { Navigate, useLocation } from 'react-router-dom';
import { FooterLink, PublicLayout } from '@/components/layouts/public-layout';
import { paths, safeNextPath } from '@/config/paths';
import { sessionQueries } from '@/lib/auth';
import { SignInForm } from '@/features/auth/components/sign-in-form';

/** Someone already signed in goes on to where they were headed, as soon as /api/me says so. */
function OnwardWhenSignedIn() {
  const location = useLocation();
  const me = useQuery(sessionQueries.me());
  if (!me.data) return null;
  return <Navigate to={safeNextPath(new URLSearchParams(location.search).get('next'))} replace />;
}

// The form shows at once rather than after /api/me answers: on a slow phone link that answer is the page's
// longest wait, and most people who open the sign-in page are signed out (issue 16: the sign-in page's own weight).
export function SignInPage() {
  return (
    <PublicLayout
      title="Sign in"
      intro="Vans, kits, stock and jobs for your heating firm."
      footer={<FooterLink to={paths.signUp.getHref()}>New here? Create a firm</FooterLink>}
    >
      <OnwardWhenSignedIn />
      <SignInForm />
    </PublicLayout>
  );
}
