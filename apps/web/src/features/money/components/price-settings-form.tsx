import { useState } from 'react';
import { moneySettingsInputSchema, parsePounds, UK_STANDARD_VAT_RATE_BP, type MoneySettings } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { useSchemaForm } from '@/lib/form';
import { penceToPoundsText, useSaveMoneySettings } from '../api/price-invoice-actions';

const fields = [
  'vatRegistered',
  'vatNumber',
  'vatRateBp',
  'paymentTermsDays',
  'quoteValidityDays',
  'firstReminderDays',
  'secondReminderDays',
  'invoiceOnCompletion',
] as const;

const wholeOrText = (v: string | undefined) => (v && /^\d+$/.test(v.trim()) ? Number(v) : v);

function prepare(values: Record<string, string | undefined>) {
  const registered = values.vatRegistered === 'yes';
  // A percentage to two places is basis points the way pounds are pence ("17.5" -> 1750), so the domain's exact
  // pounds parser reads it without a float.
  const rate = registered ? parsePounds(values.vatRateBp ?? '') : UK_STANDARD_VAT_RATE_BP;
  return {
    vatRegistered: values.vatRegistered === undefined ? undefined : registered,
    vatNumber: registered && values.vatNumber?.trim() ? values.vatNumber : null,
    vatRateBp: rate ?? values.vatRateBp,
    paymentTermsDays: wholeOrText(values.paymentTermsDays),
    quoteValidityDays: wholeOrText(values.quoteValidityDays),
    firstReminderDays: wholeOrText(values.firstReminderDays),
    secondReminderDays: wholeOrText(values.secondReminderDays),
    invoiceOnCompletion: values.invoiceOnCompletion === 'on',
  };
}

/** VAT registration, terms, quote validity, the overdue reminders and invoicing on completion (Owner, Admin). */
export function PriceSettingsForm({ settings }: { settings: MoneySettings }) {
  const save = useSaveMoneySettings();
  const form = useSchemaForm(moneySettingsInputSchema, fields, prepare);
  const [registered, setRegistered] = useState(settings.vatRegistered);
  const radio = 'flex min-h-12 items-center gap-3';
  return (
    <form
      ref={form.formRef}
      noValidate
      aria-label="Money settings"
      className="space-y-4"
      onSubmit={form.handleSubmit((input) => save.mutate(input, { onError: form.showError }))}
    >
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      {save.isSuccess ? <Alert tone="success">Money settings saved.</Alert> : null}
      {!settings.saved ? (
        <Alert tone="info">Not saved yet: nothing is invoiced until the firm saves these settings.</Alert>
      ) : null}
      <fieldset className="space-y-1">
        <legend className="font-semibold">VAT</legend>
        <label className={radio}>
          <input
            type="radio"
            name="vatRegistered"
            value="yes"
            checked={registered}
            onChange={() => setRegistered(true)}
            className="size-5 accent-brand-700"
          />
          Registered for VAT
        </label>
        <label className={radio}>
          <input
            type="radio"
            name="vatRegistered"
            value="no"
            checked={!registered}
            onChange={() => setRegistered(false)}
            className="size-5 accent-brand-700"
          />
          Not registered (no VAT charged, no VAT number printed)
        </label>
      </fieldset>
      {registered ? (
        <div className="grid gap-3 sm:grid-cols-2">
          <TextField
            label="VAT number"
            name="vatNumber"
            defaultValue={settings.vatNumber ?? ''}
            autoCapitalize="characters"
            hint="GB and 9 digits, as printed on your VAT certificate"
            error={form.fieldErrors.vatNumber}
          />
          <TextField
            label="VAT rate (%)"
            name="vatRateBp"
            inputMode="decimal"
            defaultValue={penceToPoundsText(settings.vatRateBp).replace(/\.00$/, '')}
            hint="The standard rate is 20%"
            error={form.fieldErrors.vatRateBp}
          />
        </div>
      ) : null}
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField
          label="Payment terms (days)"
          name="paymentTermsDays"
          inputMode="numeric"
          defaultValue={String(settings.paymentTermsDays)}
          error={form.fieldErrors.paymentTermsDays}
        />
        <TextField
          label="Quotes valid for (days)"
          name="quoteValidityDays"
          inputMode="numeric"
          defaultValue={String(settings.quoteValidityDays)}
          error={form.fieldErrors.quoteValidityDays}
        />
        <TextField
          label="First overdue reminder (days after due)"
          name="firstReminderDays"
          inputMode="numeric"
          defaultValue={String(settings.firstReminderDays)}
          error={form.fieldErrors.firstReminderDays}
        />
        <TextField
          label="Second overdue reminder (days after due)"
          name="secondReminderDays"
          inputMode="numeric"
          defaultValue={String(settings.secondReminderDays)}
          error={form.fieldErrors.secondReminderDays}
        />
      </div>
      <label className="flex min-h-12 items-center gap-3">
        <input
          type="checkbox"
          name="invoiceOnCompletion"
          defaultChecked={settings.invoiceOnCompletion}
          className="size-5 accent-brand-700"
        />
        <span>
          <span className="font-semibold">Invoice on completion</span>
          <span className="block text-sm text-ink-muted">Issue the invoice when the engineer completes the job</span>
        </span>
      </label>
      <p className="text-sm text-ink-muted">Rounding: {settings.roundingRule}</p>
      <Button type="submit" busy={save.isPending}>
        Save money settings
      </Button>
    </form>
  );
}
