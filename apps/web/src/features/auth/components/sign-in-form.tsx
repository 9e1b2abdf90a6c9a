import { useEffect } from 'react';
import { Link } from 'react-router-dom';
import { signInInputSchema } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { paths } from '@/config/paths';
import { useSchemaForm } from '@/lib/form';
import { useHydrated } from '@/lib/use-hydrated';
import { useSignIn } from '@/features/auth/api/use-sign-in';

const fields = ['email', 'password'] as const;

export function SignInForm() {
  const signIn = useSignIn();
  const form = useSchemaForm(signInInputSchema, fields);
  const hydrated = useHydrated();
  // The pre-rendered page's boot script holds a submit made before the app took the page over, and sends it on this
  // (packages/devstack/src/prerender-sign-in.ts).
  useEffect(() => {
    window.dispatchEvent(new Event('heatfleet:sign-in-ready'));
  }, []);

  return (
    <form
      ref={form.formRef}
      // Never used while the scripts run (before the app takes the page over, its boot script holds a submit); with
      // scripts off the button stays disabled, and the browser's own submit would post, which the API sends back to
      // the page, rather than putting the password into the address as a GET.
      method="post"
      noValidate
      className="space-y-4"
      onSubmit={form.handleSubmit((input) => signIn.mutate(input, { onError: form.showError }))}
    >
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
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
        autoComplete="current-password"
        required
        error={form.fieldErrors.password}
      />
      <Button type="submit" busy={signIn.isPending} disabled={!hydrated} className="w-full">
        Sign in
      </Button>
      <p className="text-center">
        <Link
          to={paths.resetPassword.getHref()}
          className="inline-block py-2 font-semibold text-brand-700 underline-offset-4 hover:underline"
        >
          Forgotten your password?
        </Link>
      </p>
    </form>
  );
}
