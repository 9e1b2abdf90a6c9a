import { useState } from 'react';
import { PASSWORD_MIN_LENGTH, changePasswordInputSchema } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { useSchemaForm } from '@/lib/form';
import { useChangePassword } from '@/features/auth/api/use-change-password';

const fields = ['currentPassword', 'newPassword'] as const;

/** `email` fills a hidden username field so password managers know which account the new password is for. */
export function ChangePasswordForm({ email }: { email: string }) {
  const change = useChangePassword();
  const form = useSchemaForm(changePasswordInputSchema, fields);
  const [saved, setSaved] = useState(false);

  return (
    <form
      ref={form.formRef}
      noValidate
      className="space-y-4"
      onSubmit={form.handleSubmit((input) => {
        setSaved(false);
        change.mutate(input, {
          onError: form.showError,
          onSuccess: () => {
            setSaved(true);
            form.formRef.current?.reset();
          },
        });
      })}
    >
      <input type="email" name="username" autoComplete="username" value={email} readOnly hidden />
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      {saved ? (
        <Alert tone="success">Password changed. Any other devices signed in as you have been signed out.</Alert>
      ) : null}
      <TextField
        label="Current password"
        name="currentPassword"
        type="password"
        autoComplete="current-password"
        required
        error={form.fieldErrors.currentPassword}
      />
      <TextField
        label="New password"
        name="newPassword"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
        required
        error={form.fieldErrors.newPassword}
      />
      <Button type="submit" busy={change.isPending}>
        Change password
      </Button>
    </form>
  );
}
