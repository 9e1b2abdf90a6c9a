import { useId } from 'react';
import { useQuery } from '@tanstack/react-query';
import {
  COLD_BOTTOM_THRESHOLD_MAX_K,
  COLD_BOTTOM_THRESHOLD_MIN_K,
  firmSettingsInputSchema,
  volumeUnitLabels,
  volumeUnits,
  type FirmSettings,
} from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { TextField } from '@/components/ui/text-field';
import { TextareaField } from '@/components/ui/textarea-field';
import { useSchemaForm } from '@/lib/form';
import { firmSettingsQueries, useSaveFirmSettings } from '@/features/firms/api/firm-settings-queries';
import { HeatExchangerFields } from '@/features/firms/components/heat-exchanger-fields';
import { heatExchangerFieldNames, heatExchangerInput } from '@/features/firms/components/heat-exchanger-input';

const fields = [
  'name',
  'address',
  'timeZone',
  'volumeUnit',
  'coldBottomThresholdK',
  'phone',
  'email',
  'registrationNumbers',
  'restockDays',
  ...heatExchangerFieldNames,
] as const;

function prepare(values: Record<string, string | undefined>) {
  return {
    name: values.name ?? '',
    address: values.address ?? '',
    timeZone: values.timeZone ?? '',
    volumeUnit: values.volumeUnit,
    coldBottomThresholdK: values.coldBottomThresholdK?.trim() ? Number(values.coldBottomThresholdK) : undefined,
    phone: values.phone ?? '',
    email: values.email ?? '',
    registrationNumbers: values.registrationNumbers ?? '',
    heatExchangerDefaults: heatExchangerInput(values),
    restockDays: values.restockDays?.trim() ? Number(values.restockDays) : undefined,
  };
}

// Every zone the browser knows, offered as suggestions; the API checks the same way with Intl.
const zones: string[] = typeof Intl.supportedValuesOf === 'function' ? Intl.supportedValuesOf('timeZone') : [];

function Form({ firm }: { firm: FirmSettings }) {
  const save = useSaveFirmSettings();
  const form = useSchemaForm(firmSettingsInputSchema, fields, prepare);
  const listId = useId();
  return (
    <form
      ref={form.formRef}
      noValidate
      aria-label="Firm settings"
      className="space-y-4"
      onSubmit={form.handleSubmit((input) => save.mutate(input, { onError: form.showError }))}
    >
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      {save.isSuccess ? <Alert tone="success">Firm settings saved.</Alert> : null}
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          label="Firm name"
          name="name"
          maxLength={120}
          defaultValue={firm.name}
          error={form.fieldErrors.name}
        />
        <div>
          <TextField
            label="Time zone"
            name="timeZone"
            list={listId}
            autoComplete="off"
            defaultValue={firm.timeZone}
            hint="Due dates and each day's vibration points follow this zone, e.g. Europe/London."
            error={form.fieldErrors.timeZone}
          />
          <datalist id={listId}>
            {zones.map((z) => (
              <option key={z} value={z} />
            ))}
          </datalist>
        </div>
      </div>
      <TextareaField
        label="Address"
        name="address"
        rows={3}
        maxLength={500}
        defaultValue={firm.address ?? ''}
        hint="Printed on the cleaning reports."
        error={form.fieldErrors.address}
      />
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          label="Phone"
          name="phone"
          type="tel"
          inputMode="tel"
          autoComplete="tel"
          maxLength={40}
          defaultValue={firm.phone ?? ''}
          hint="Printed on the customer’s report."
          error={form.fieldErrors.phone}
        />
        <TextField
          label="E-mail"
          name="email"
          type="email"
          inputMode="email"
          autoComplete="email"
          maxLength={254}
          defaultValue={firm.email ?? ''}
          hint="Printed on the customer’s report."
          error={form.fieldErrors.email}
        />
      </div>
      <TextField
        label="Registration numbers"
        name="registrationNumbers"
        maxLength={300}
        defaultValue={firm.registrationNumbers ?? ''}
        hint="As they should appear on the report, for example a trade scheme’s registration number."
        error={form.fieldErrors.registrationNumbers}
      />
      <ChoiceGroup
        legend="Volumes shown in"
        name="volumeUnit"
        columns={2}
        defaultValue={firm.volumeUnit}
        options={volumeUnits.map((u) => ({ value: u, label: volumeUnitLabels[u] }))}
        error={form.fieldErrors.volumeUnit}
      />
      <TextField
        label="Cold-bottom threshold (K, top to bottom)"
        name="coldBottomThresholdK"
        type="number"
        inputMode="decimal"
        min={COLD_BOTTOM_THRESHOLD_MIN_K}
        max={COLD_BOTTOM_THRESHOLD_MAX_K}
        step="0.5"
        defaultValue={String(firm.coldBottomThresholdK)}
        hint={`A radiator is flagged for sludge when its top is warmer than its bottom by more than this (${COLD_BOTTOM_THRESHOLD_MIN_K} to ${COLD_BOTTOM_THRESHOLD_MAX_K} K; 10 K is common practice).`}
        error={form.fieldErrors.coldBottomThresholdK}
        className="sm:max-w-xs"
      />
      <TextField
        label="Restock for booked jobs (days ahead)"
        name="restockDays"
        type="number"
        inputMode="numeric"
        min={1}
        max={60}
        step={1}
        defaultValue={String(firm.restockDays)}
        hint="The restock run fills each van for its booked jobs of this many days (today included), keeping its minimum."
        error={form.fieldErrors.restockDays}
        className="sm:max-w-xs"
      />
      <HeatExchangerFields
        defaults={firm.heatExchangerDefaults}
        own={firm.heatExchangerDefaultsOwn}
        errors={form.fieldErrors}
      />
      <Button type="submit" busy={save.isPending} className="min-h-12 w-full sm:w-auto">
        Save firm settings
      </Button>
    </form>
  );
}

export function FirmSettingsForm() {
  const firm = useQuery(firmSettingsQueries.detail());
  if (firm.isPending) return <PageSpinner label="Loading the firm…" />;
  if (firm.isError) return <QueryErrorNotice error={firm.error} onRetry={() => void firm.refetch()} />;
  return <Form firm={firm.data} />;
}
