import { passwordResetRequestSchema } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { useSchemaForm } from '@/lib/form';
import { useRequestPasswordReset } from '@/features/auth/api/use-password-reset';

const fields = ['email'] as const;

export function ResetRequestForm() {
  const request = useRequestPasswordReset();
  const form = useSchemaForm(passwordResetRequestSchema, fields);

  if (request.isSuccess) {
    return (
      <Alert tone="success" title="Check your e-mail">
        {request.data.message}
      </Alert>
    );
  }

  return (
    <form
      ref={form.formRef}
      noValidate
      className="space-y-4"
      onSubmit={form.handleSubmit((input) => request.mutate(input, { onError: form.showError }))}
    >
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      <TextField
        label="E-mail"
        name="email"
        type="email"
        autoComplete="email"
        inputMode="email"
        hint="We will send a link to choose a new password. It works once and expires."
        required
        error={form.fieldErrors.email}
      />
      <Button type="submit" busy={request.isPending} className="w-full">
        Send the link
      </Button>
    </form>
  );
}
