import { useParams } from 'react-router-dom';
import { FooterLink, PublicLayout } from '@/components/layouts/public-layout';
import { paths } from '@/config/paths';
import { ResetPasswordForm } from '@/features/auth/components/reset-password-form';

export function ChooseNewPasswordPage() {
  const { token = '' } = useParams();
  return (
    <PublicLayout
      title="Choose a new password"
      footer={<FooterLink to={paths.resetPassword.getHref()}>Link expired? Ask for a new one</FooterLink>}
    >
      <ResetPasswordForm token={token} />
    </PublicLayout>
  );
}
