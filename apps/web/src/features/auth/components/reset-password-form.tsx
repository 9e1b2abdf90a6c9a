import { Link } from 'react-router-dom';
import { PASSWORD_MIN_LENGTH, passwordResetConfirmSchema } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button, buttonClasses } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { paths } from '@/config/paths';
import { useSchemaForm } from '@/lib/form';
import { useConfirmPasswordReset } from '@/features/auth/api/use-password-reset';

const fields = ['password'] as const;
const passwordOnlySchema = passwordResetConfirmSchema.pick({ password: true });

export function ResetPasswordForm({ token }: { token: string }) {
  const confirm = useConfirmPasswordReset();
  const form = useSchemaForm(passwordOnlySchema, fields);
  const tokenCheck = passwordResetConfirmSchema.shape.token.safeParse(token);

  if (!tokenCheck.success) {
    return (
      <div className="space-y-4">
        <Alert tone="error">{tokenCheck.error.issues[0]?.message ?? 'The link is not valid.'}</Alert>
        <Link to={paths.resetPassword.getHref()} className={buttonClasses('secondary', 'w-full')}>
          Ask for a new link
        </Link>
      </div>
    );
  }

  if (confirm.isSuccess) {
    return (
      <div className="space-y-4">
        <Alert tone="success" title="Password changed">
          {confirm.data.message}
        </Alert>
        <Link to={paths.signIn.getHref()} className={buttonClasses('primary', 'w-full')}>
          Sign in
        </Link>
      </div>
    );
  }

  return (
    <form
      ref={form.formRef}
      noValidate
      className="space-y-4"
      onSubmit={form.handleSubmit(({ password }) =>
        confirm.mutate({ token: tokenCheck.data, password }, { onError: form.showError }),
      )}
    >
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      <TextField
        label="New password"
        name="password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
        required
        error={form.fieldErrors.password}
      />
      <Button type="submit" busy={confirm.isPending} className="w-full">
        Save the new password
      </Button>
    </form>
  );
}
