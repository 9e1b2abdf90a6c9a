import { useState } from 'react';
import { customerInputSchema, siteInputSchema } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { firstErrorPerField, type FieldErrors } from '@/lib/form';
import { useCreateCustomer, useCreateSite } from '@/features/jobs/api/use-job-mutations';

// Adding a customer or a site while booking, without leaving the form.

export function NewCustomer({ onAdded }: { onAdded: (customer: { id: number; name: string }) => void }) {
  const [draft, setDraft] = useState({ name: '', email: '', phone: '' });
  const [errors, setErrors] = useState<FieldErrors>({});
  const create = useCreateCustomer();
  const add = () => {
    const parsed = customerInputSchema.safeParse(draft);
    if (!parsed.success) return setErrors(firstErrorPerField(parsed.error.issues));
    setErrors({});
    create.mutate(parsed.data, { onSuccess: (customer) => onAdded(customer) });
  };
  return (
    <div role="group" aria-label="New customer" className="space-y-3 rounded-lg border border-line-strong p-3">
      <TextField
        className="[&_input]:min-h-12"
        label="Customer name"
        name="customer.name"
        value={draft.name}
        onChange={(e) => setDraft({ ...draft, name: e.target.value })}
        error={errors.name}
      />
      <TextField
        className="[&_input]:min-h-12"
        label="E-mail (optional)"
        name="customer.email"
        type="email"
        value={draft.email}
        onChange={(e) => setDraft({ ...draft, email: e.target.value })}
        error={errors.email}
      />
      <TextField
        className="[&_input]:min-h-12"
        label="Phone (optional)"
        name="customer.phone"
        type="tel"
        value={draft.phone}
        onChange={(e) => setDraft({ ...draft, phone: e.target.value })}
        error={errors.phone}
      />
      {create.isError ? <Alert tone="error">{create.error.message}</Alert> : null}
      <Button variant="secondary" className="min-h-12" busy={create.isPending} onClick={add}>
        Add the customer
      </Button>
    </div>
  );
}

export function NewSite({
  customerId,
  onAdded,
}: {
  customerId: number;
  onAdded: (site: { id: number; address: string; postcode: string | null }) => void;
}) {
  const [draft, setDraft] = useState({ address: '', postcode: '', accessNotes: '' });
  const [errors, setErrors] = useState<FieldErrors>({});
  const create = useCreateSite(customerId);
  const add = () => {
    const parsed = siteInputSchema.safeParse(draft);
    if (!parsed.success) return setErrors(firstErrorPerField(parsed.error.issues));
    setErrors({});
    create.mutate(parsed.data, {
      onSuccess: (site) => onAdded({ id: site.id, address: site.address, postcode: site.postcode ?? null }),
    });
  };
  return (
    <div role="group" aria-label="New site" className="space-y-3 rounded-lg border border-line-strong p-3">
      <TextField
        className="[&_input]:min-h-12"
        label="Site address"
        name="site.address"
        value={draft.address}
        onChange={(e) => setDraft({ ...draft, address: e.target.value })}
        error={errors.address}
      />
      <TextField
        className="[&_input]:min-h-12"
        label="Postcode (optional)"
        name="site.postcode"
        value={draft.postcode}
        onChange={(e) => setDraft({ ...draft, postcode: e.target.value })}
        error={errors.postcode}
      />
      <TextField
        className="[&_input]:min-h-12"
        label="Access notes (optional)"
        name="site.accessNotes"
        value={draft.accessNotes}
        onChange={(e) => setDraft({ ...draft, accessNotes: e.target.value })}
        error={errors.accessNotes}
      />
      {create.isError ? <Alert tone="error">{create.error.message}</Alert> : null}
      <Button variant="secondary" className="min-h-12" busy={create.isPending} onClick={add}>
        Add the site
      </Button>
    </div>
  );
}
