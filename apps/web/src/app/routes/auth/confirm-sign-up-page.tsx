import { Link, useNavigate, useParams } from 'react-router-dom';
import { signUpConfirmSchema } from '@heatfleet/domain';
import { FooterLink, PublicLayout } from '@/components/layouts/public-layout';
import { Alert } from '@/components/ui/alert';
import { Button, buttonClasses } from '@/components/ui/button';
import { paths } from '@/config/paths';
import { useConfirmSignUp } from '@/features/auth/api/use-sign-up';

/**
 * The link from the sign-up e-mail. Creating the firm takes a tap, not just opening the page:
 * mail scanners open links by themselves, and must not spend this one.
 */
export function ConfirmSignUpPage() {
  const { token = '' } = useParams();
  const navigate = useNavigate();
  const confirm = useConfirmSignUp();
  const tokenCheck = signUpConfirmSchema.shape.token.safeParse(token);

  return (
    <PublicLayout
      title="Finish creating your firm"
      intro="One tap creates your account and your firm, and signs you in as its Owner."
      footer={<FooterLink to={paths.signUp.getHref()}>Link expired? Sign up again</FooterLink>}
    >
      {!tokenCheck.success ? (
        <div className="space-y-4">
          <Alert tone="error">{tokenCheck.error.issues[0]?.message ?? 'The link is not valid.'}</Alert>
          <Link to={paths.signUp.getHref()} className={buttonClasses('secondary', 'w-full')}>
            Sign up again
          </Link>
        </div>
      ) : (
        <div className="space-y-4">
          {confirm.isError ? <Alert tone="error">{confirm.error.message}</Alert> : null}
          <Button
            className="w-full"
            busy={confirm.isPending}
            onClick={() =>
              confirm.mutate(
                { token: tokenCheck.data },
                { onSuccess: () => void navigate(paths.home.getHref(), { replace: true }) },
              )
            }
          >
            Create the firm
          </Button>
        </div>
      )}
    </PublicLayout>
  );
}
