import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { customerInputSchema, siteInputSchema } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { firstErrorPerField, type FieldErrors } from '@/lib/form';
import { customerQueries } from '@/features/jobs/api/job-queries';
import { useCreateCustomer, useCreateSite } from '@/features/jobs/api/use-job-mutations';

const NEW = 'new';

function NewCustomer({ onAdded }: { onAdded: (id: number) => void }) {
  const [draft, setDraft] = useState({ name: '', email: '', phone: '' });
  const [errors, setErrors] = useState<FieldErrors>({});
  const create = useCreateCustomer();
  const add = () => {
    const parsed = customerInputSchema.safeParse(draft);
    if (!parsed.success) return setErrors(firstErrorPerField(parsed.error.issues));
    setErrors({});
    create.mutate(parsed.data, { onSuccess: (customer) => onAdded(customer.id) });
  };
  return (
    <div role="group" aria-label="New customer" className="space-y-3 rounded-lg border border-line-strong p-3">
      <TextField
        label="Customer name"
        name="customer.name"
        value={draft.name}
        onChange={(e) => setDraft({ ...draft, name: e.target.value })}
        error={errors.name}
      />
      <TextField
        label="E-mail (optional)"
        name="customer.email"
        type="email"
        value={draft.email}
        onChange={(e) => setDraft({ ...draft, email: e.target.value })}
        error={errors.email}
      />
      <TextField
        label="Phone (optional)"
        name="customer.phone"
        type="tel"
        value={draft.phone}
        onChange={(e) => setDraft({ ...draft, phone: e.target.value })}
        error={errors.phone}
      />
      {create.isError ? <Alert tone="error">{create.error.message}</Alert> : null}
      <Button variant="secondary" busy={create.isPending} onClick={add}>
        Add the customer
      </Button>
    </div>
  );
}

function NewSite({ customerId, onAdded }: { customerId: number; onAdded: (id: number) => void }) {
  const [draft, setDraft] = useState({ address: '', postcode: '', accessNotes: '' });
  const [errors, setErrors] = useState<FieldErrors>({});
  const create = useCreateSite(customerId);
  const add = () => {
    const parsed = siteInputSchema.safeParse(draft);
    if (!parsed.success) return setErrors(firstErrorPerField(parsed.error.issues));
    setErrors({});
    create.mutate(parsed.data, { onSuccess: (site) => onAdded(site.id) });
  };
  return (
    <div role="group" aria-label="New site" className="space-y-3 rounded-lg border border-line-strong p-3">
      <TextField
        label="Site address"
        name="site.address"
        value={draft.address}
        onChange={(e) => setDraft({ ...draft, address: e.target.value })}
        error={errors.address}
      />
      <TextField
        label="Postcode (optional)"
        name="site.postcode"
        value={draft.postcode}
        onChange={(e) => setDraft({ ...draft, postcode: e.target.value })}
        error={errors.postcode}
      />
      <TextField
        label="Access notes (optional)"
        name="site.accessNotes"
        value={draft.accessNotes}
        onChange={(e) => setDraft({ ...draft, accessNotes: e.target.value })}
        error={errors.accessNotes}
      />
      {create.isError ? <Alert tone="error">{create.error.message}</Alert> : null}
      <Button variant="secondary" busy={create.isPending} onClick={add}>
        Add the site
      </Button>
    </div>
  );
}

/** Pick a customer and one of their sites, or add either on the spot. */
export function CustomerSitePicker({
  siteId,
  onSiteChange,
  siteError,
}: {
  siteId: number | null;
  onSiteChange: (siteId: number | null) => void;
  siteError?: string | undefined;
}) {
  const [customerChoice, setCustomerChoice] = useState('');
  const [siteChoice, setSiteChoice] = useState(siteId ? String(siteId) : '');
  const customers = useQuery(customerQueries.list());
  const customerId = customerChoice && customerChoice !== NEW ? Number(customerChoice) : null;
  const customer = useQuery({ ...customerQueries.detail(customerId ?? 0), enabled: customerId !== null });

  const chooseSite = (value: string) => {
    setSiteChoice(value);
    onSiteChange(value && value !== NEW ? Number(value) : null);
  };

  return (
    <fieldset className="space-y-3">
      <legend className="text-lg font-bold text-brand-900">Customer and site</legend>
      <SelectField
        label="Customer"
        value={customerChoice}
        disabled={customers.isPending}
        onChange={(e) => {
          setCustomerChoice(e.target.value);
          chooseSite('');
        }}
        options={[
          { value: '', label: customers.isPending ? 'Loading customers…' : 'Choose a customer' },
          ...(customers.data ?? []).map((c) => ({ value: String(c.id), label: c.name })),
          { value: NEW, label: 'A new customer…' },
        ]}
      />
      {customerChoice === NEW ? <NewCustomer onAdded={(id) => setCustomerChoice(String(id))} /> : null}
      {customerId !== null ? (
        <>
          <SelectField
            label="Site"
            value={siteChoice}
            disabled={customer.isPending}
            error={siteError}
            onChange={(e) => chooseSite(e.target.value)}
            options={[
              { value: '', label: customer.isPending ? 'Loading sites…' : 'Choose a site' },
              ...(customer.data?.sites ?? []).map((s) => ({ value: String(s.id), label: s.address })),
              { value: NEW, label: 'A new site…' },
            ]}
          />
          {siteChoice === NEW ? <NewSite customerId={customerId} onAdded={(id) => chooseSite(String(id))} /> : null}
        </>
      ) : siteError ? (
        <p className="text-sm font-semibold text-danger-700">{siteError}</p>
      ) : null}
    </fieldset>
  );
}
