import { useNavigate } from 'react-router-dom';
import {
  PASSWORD_MIN_LENGTH,
  acceptInvitationInputSchema,
  passwordSchema,
  personNameSchema,
  roleLabels,
  roleSummaries,
  type InvitationPreview,
} from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { paths } from '@/config/paths';
import { useSchemaForm } from '@/lib/form';
import { useAcceptInvitation } from '@/features/invitations/api/use-accept-invitation';

// The API's schema leaves name optional for existing accounts; a new account needs both, and a long password.
const newAccountSchema = acceptInvitationInputSchema.extend({ name: personNameSchema, password: passwordSchema });
const existingAccountSchema = acceptInvitationInputSchema.pick({ password: true });
const newAccountFields = ['name', 'password'] as const;
const existingAccountFields = ['password'] as const;

interface AcceptInvitationFormProps {
  token: string;
  invitation: InvitationPreview;
  /** E-mail of whoever is signed in on this device now, if anyone. */
  signedInAs: string | null;
}

export function InvitationSummary({ invitation }: { invitation: InvitationPreview }) {
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-2 rounded-lg bg-brand-50 p-4">
      <dt className="font-semibold text-ink-muted">Firm</dt>
      <dd className="font-semibold [overflow-wrap:anywhere]">{invitation.firmName}</dd>
      <dt className="font-semibold text-ink-muted">Role</dt>
      <dd>
        <span className="font-semibold">{roleLabels[invitation.role]}</span>
        <span className="block text-sm text-ink-muted">{roleSummaries[invitation.role]}</span>
      </dd>
      <dt className="font-semibold text-ink-muted">E-mail</dt>
      <dd className="[overflow-wrap:anywhere]">{invitation.email}</dd>
    </dl>
  );
}

function NewAccountForm({ token }: { token: string }) {
  const navigate = useNavigate();
  const accept = useAcceptInvitation();
  const form = useSchemaForm(newAccountSchema, newAccountFields);
  return (
    <form
      ref={form.formRef}
      noValidate
      className="space-y-4"
      onSubmit={form.handleSubmit((input) =>
        accept.mutate(
          { token, ...input },
          { onError: form.showError, onSuccess: () => navigate(paths.home.getHref()) },
        ),
      )}
    >
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      <TextField label="Your name" name="name" autoComplete="name" required error={form.fieldErrors.name} />
      <TextField
        label="Choose a password"
        name="password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
        required
        error={form.fieldErrors.password}
      />
      <Button type="submit" busy={accept.isPending} className="w-full">
        Create my account and join
      </Button>
    </form>
  );
}

function ExistingAccountForm({ token, email }: { token: string; email: string }) {
  const navigate = useNavigate();
  const accept = useAcceptInvitation();
  const form = useSchemaForm(existingAccountSchema, existingAccountFields);
  return (
    <form
      ref={form.formRef}
      noValidate
      className="space-y-4"
      onSubmit={form.handleSubmit((input) =>
        accept.mutate(
          { token, ...input },
          { onError: form.showError, onSuccess: () => navigate(paths.home.getHref()) },
        ),
      )}
    >
      <p>{email} already has a Heatfleet account. Sign in with your existing password to join.</p>
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      <TextField
        label="Your password"
        name="password"
        type="password"
        autoComplete="current-password"
        required
        error={form.fieldErrors.password}
      />
      <Button type="submit" busy={accept.isPending} className="w-full">
        Sign in and join
      </Button>
    </form>
  );
}

export function AcceptInvitationForm({ token, invitation, signedInAs }: AcceptInvitationFormProps) {
  return (
    <div className="space-y-5">
      <InvitationSummary invitation={invitation} />
      {signedInAs && signedInAs !== invitation.email ? (
        <Alert tone="info">
          You are signed in as {signedInAs} on this device. Joining signs you in as {invitation.email} instead.
        </Alert>
      ) : null}
      {invitation.accountExists ? (
        <ExistingAccountForm token={token} email={invitation.email} />
      ) : (
        <NewAccountForm token={token} />
      )}
    </div>
  );
}
