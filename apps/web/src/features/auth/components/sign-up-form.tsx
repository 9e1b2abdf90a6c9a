import type { ReactNode } from 'react';
import { PASSWORD_MIN_LENGTH, signUpInputSchema } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { useSchemaForm } from '@/lib/form';
import { useSignUp } from '@/features/auth/api/use-sign-up';

const fields = ['firmName', 'name', 'email', 'password'] as const;

export function SignUpForm({ outboxLink }: { outboxLink?: ReactNode }) {
  const signUp = useSignUp();
  const form = useSchemaForm(signUpInputSchema, fields);

  if (signUp.isSuccess) {
    return (
      <div className="space-y-4">
        <Alert tone="success" title="Check your e-mail">
          {signUp.data.message}
        </Alert>
        <p className="text-ink-muted">
          Sent to <strong className="[overflow-wrap:anywhere]">{signUp.variables.email}</strong>. Nothing arrived after
          a few minutes? Look in spam, or try again.
        </p>
        {outboxLink}
        <Button variant="secondary" className="w-full" onClick={() => signUp.reset()}>
          Use another address
        </Button>
      </div>
    );
  }

  return (
    <form
      ref={form.formRef}
      noValidate
      className="space-y-4"
      onSubmit={form.handleSubmit((input) => signUp.mutate(input, { onError: form.showError }))}
    >
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      <TextField
        label="Firm name"
        name="firmName"
        autoComplete="organization"
        required
        error={form.fieldErrors.firmName}
      />
      <TextField label="Your name" name="name" autoComplete="name" required error={form.fieldErrors.name} />
      <TextField
        label="E-mail"
        name="email"
        type="email"
        autoComplete="email"
        inputMode="email"
        required
        error={form.fieldErrors.email}
      />
      <TextField
        label="Password"
        name="password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters. A few unrelated words make a strong one.`}
        required
        error={form.fieldErrors.password}
      />
      <Button type="submit" busy={signUp.isPending} className="w-full">
        E-mail me the link
      </Button>
    </form>
  );
}
