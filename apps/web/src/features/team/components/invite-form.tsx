import { useState } from 'react';
import { subject } from '@casl/ability';
import { createInvitationInputSchema, roleLabels, roles, type Role } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { useAbility } from '@/lib/ability';
import { useSchemaForm } from '@/lib/form';
import { useCreateInvitation } from '@/features/team/api/use-create-invitation';

const fields = ['email', 'role'] as const;
const defaultRole: Role = 'engineer';

export function InviteForm({ firmId }: { firmId: number }) {
  const ability = useAbility();
  const create = useCreateInvitation();
  const form = useSchemaForm(createInvitationInputSchema, fields);
  const [sentTo, setSentTo] = useState<string | null>(null);

  const roleOptions = roles
    .filter((role) => ability.can('create', subject('Invitation', { firmId, role })))
    .map((role) => ({ value: role, label: roleLabels[role] }));

  return (
    <form
      ref={form.formRef}
      noValidate
      className="space-y-4"
      onSubmit={form.handleSubmit((input) => {
        setSentTo(null);
        create.mutate(input, {
          onError: form.showError,
          onSuccess: (invitation) => {
            setSentTo(invitation.email);
            form.formRef.current?.reset();
          },
        });
      })}
    >
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      {sentTo ? <Alert tone="success">Invitation sent to {sentTo}.</Alert> : null}
      <div className="grid gap-4 sm:grid-cols-[1fr_12rem]">
        <TextField
          label="E-mail of the person to invite"
          name="email"
          type="email"
          inputMode="email"
          autoComplete="off"
          required
          error={form.fieldErrors.email}
        />
        <SelectField
          label="Role"
          name="role"
          options={roleOptions}
          defaultValue={defaultRole}
          error={form.fieldErrors.role}
        />
      </div>
      <Button type="submit" busy={create.isPending}>
        Send invitation
      </Button>
    </form>
  );
}
