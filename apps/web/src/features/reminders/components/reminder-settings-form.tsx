import { useQuery } from '@tanstack/react-query';
import { reminderSettingsSchema, type ReminderSettingsView } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { SelectField } from '@/components/ui/select-field';
import { formatCalendarDate } from '@/lib/format';
import { useSchemaForm } from '@/lib/form';
import { reminderQueries } from '@/features/reminders/api/reminder-queries';
import { useSaveReminderSettings } from '@/features/reminders/api/use-reminder-actions';

const fields = [
  'scanHour',
  'inspectionReminders',
  'vanReminders',
  'stockReminders',
  'annualCheckReminders',
  'annualCheckCustomerEmails',
] as const;
const hours = Array.from({ length: 24 }, (_, h) => ({ value: String(h), label: `${String(h).padStart(2, '0')}:00` }));

function prepare(values: Record<string, string | undefined>) {
  return {
    scanHour: values.scanHour === undefined ? undefined : Number(values.scanHour),
    inspectionReminders: values.inspectionReminders === 'on',
    vanReminders: values.vanReminders === 'on',
    stockReminders: values.stockReminders === 'on',
    annualCheckReminders: values.annualCheckReminders === 'on',
    annualCheckCustomerEmails: values.annualCheckCustomerEmails === 'on',
  };
}

function SettingsForm({ settings, timeZone }: { settings: ReminderSettingsView; timeZone: string }) {
  const save = useSaveReminderSettings();
  const form = useSchemaForm(reminderSettingsSchema, fields, prepare);
  return (
    <form
      ref={form.formRef}
      noValidate
      aria-label="Reminder settings"
      className="space-y-4"
      onSubmit={form.handleSubmit((input) => save.mutate(input, { onError: form.showError }))}
    >
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      {save.isSuccess ? <Alert tone="success">Reminder settings saved.</Alert> : null}
      <p className="text-sm text-ink-muted">
        {settings.lastScanOn
          ? `Last checked on ${formatCalendarDate(settings.lastScanOn.slice(0, 10))}.`
          : 'Not checked yet.'}
      </p>
      <SelectField
        label={`Daily check at (${timeZone})`}
        name="scanHour"
        defaultValue={String(settings.scanHour)}
        options={hours}
        error={form.fieldErrors.scanHour}
        className="sm:max-w-xs"
      />
      <label className="flex min-h-12 items-center gap-3">
        <input
          type="checkbox"
          name="inspectionReminders"
          defaultChecked={settings.inspectionReminders}
          className="size-5 accent-brand-700"
        />
        <span>
          <span className="font-semibold">Kit inspections</span>
          <span className="block text-sm text-ink-muted">
            Items due soon or overdue, to the owner, stores and each van&apos;s engineer
          </span>
        </span>
      </label>
      <label className="flex min-h-12 items-center gap-3">
        <input
          type="checkbox"
          name="vanReminders"
          defaultChecked={settings.vanReminders}
          className="size-5 accent-brand-700"
        />
        <span>
          <span className="font-semibold">Van MOT and service</span>
          <span className="block text-sm text-ink-muted">Due within 30 days</span>
        </span>
      </label>
      <label className="flex min-h-12 items-center gap-3">
        <input
          type="checkbox"
          name="stockReminders"
          defaultChecked={settings.stockReminders}
          className="size-5 accent-brand-700"
        />
        <span>
          <span className="font-semibold">Chemical stock</span>
          <span className="block text-sm text-ink-muted">
            Vans below their minimum, depot stock to reorder, batches expiring within 60 days
          </span>
        </span>
      </label>
      <label className="flex min-h-12 items-center gap-3">
        <input
          type="checkbox"
          name="annualCheckReminders"
          defaultChecked={settings.annualCheckReminders}
          className="size-5 accent-brand-700"
        />
        <span>
          <span className="font-semibold">Customers&apos; annual checks</span>
          <span className="block text-sm text-ink-muted">
            Sites due their yearly inhibitor check within 30 days, to the owner and stores
          </span>
        </span>
      </label>
      <label className="flex min-h-12 items-center gap-3">
        <input
          type="checkbox"
          name="annualCheckCustomerEmails"
          defaultChecked={settings.annualCheckCustomerEmails}
          className="size-5 accent-brand-700"
        />
        <span>
          <span className="font-semibold">Tell the customer too</span>
          <span className="block text-sm text-ink-muted">
            E-mail each customer whose e-mail is on file when their annual check falls due (once per check)
          </span>
        </span>
      </label>
      <Button type="submit" busy={save.isPending}>
        Save reminder settings
      </Button>
    </form>
  );
}

export function ReminderSettingsForm({ timeZone }: { timeZone: string }) {
  const settings = useQuery(reminderQueries.settings());
  if (settings.isPending) return <PageSpinner label="Loading settings…" />;
  if (settings.isError) return <QueryErrorNotice error={settings.error} onRetry={() => void settings.refetch()} />;
  return <SettingsForm settings={settings.data} timeZone={timeZone} />;
}
