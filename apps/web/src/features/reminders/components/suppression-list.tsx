import { useQuery } from '@tanstack/react-query';
import { marketingSuppressionInputSchema, suppressionSourceLabels } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { TextField } from '@/components/ui/text-field';
import { formatDate } from '@/lib/format';
import { useSchemaForm } from '@/lib/form';
import { reminderQueries } from '@/features/reminders/api/reminder-queries';
import { useAddSuppression } from '@/features/reminders/api/use-reminder-actions';

/**
 * The addresses never sent the yearly check offer again: those who used the link in an e-mail, and those the
 * office added when a customer asked by phone or letter (PECR 2003, regulation 22). The sender checks this list.
 */
export function SuppressionList({ timeZone }: { timeZone: string }) {
  const list = useQuery(reminderQueries.suppressions());
  const add = useAddSuppression();
  const form = useSchemaForm(marketingSuppressionInputSchema, ['email']);
  return (
    <div className="space-y-4">
      <form
        ref={form.formRef}
        noValidate
        aria-label="Stop offers to an address"
        className="flex flex-col gap-3 sm:flex-row sm:items-end"
        onSubmit={form.handleSubmit((input) =>
          add.mutate(input, { onError: form.showError, onSuccess: () => form.formRef.current?.reset() }),
        )}
      >
        <TextField
          label="Customer's e-mail address"
          name="email"
          type="email"
          inputMode="email"
          autoComplete="off"
          error={form.fieldErrors.email}
          className="sm:flex-1"
        />
        <Button type="submit" className="min-h-12" busy={add.isPending}>
          Stop offers
        </Button>
      </form>
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      {add.isSuccess ? <Alert tone="success">{add.data.email} will not be sent offers again.</Alert> : null}
      {list.isPending ? (
        <PageSpinner label="Loading the list" />
      ) : list.isError ? (
        <QueryErrorNotice error={list.error} />
      ) : list.data.length === 0 ? (
        <p className="text-ink-muted">Nobody has asked to stop the offers yet.</p>
      ) : (
        <ul aria-label="Addresses not sent offers" className="divide-y divide-line">
          {list.data.map((s) => (
            <li key={s.id} className="flex flex-wrap justify-between gap-x-4 py-2">
              <span className="font-semibold break-all">{s.email}</span>
              <span className="text-sm text-ink-muted">
                {suppressionSourceLabels[s.source]}, {formatDate(s.createdAt, timeZone)}
              </span>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
