import { useQuery } from '@tanstack/react-query';
import { createDepotInputSchema } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { TextField } from '@/components/ui/text-field';
import { useSchemaForm } from '@/lib/form';
import { depotQueries } from '@/features/vans/api/van-queries';
import { useCreateDepot } from '@/features/vans/api/use-create-depot';

const fields = ['name', 'notes'] as const;

function DepotForm() {
  const create = useCreateDepot();
  const form = useSchemaForm(createDepotInputSchema, fields);
  return (
    <form
      ref={form.formRef}
      noValidate
      aria-label="New depot"
      className="space-y-4"
      onSubmit={form.handleSubmit((input) =>
        create.mutate(input, { onError: form.showError, onSuccess: () => form.formRef.current?.reset() }),
      )}
    >
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Depot name" name="name" autoComplete="off" error={form.fieldErrors.name} />
        <TextField label="Notes" name="notes" autoComplete="off" error={form.fieldErrors.notes} />
      </div>
      <Button type="submit" variant="secondary" busy={create.isPending}>
        Add depot
      </Button>
    </form>
  );
}

/** Where kit comes back to when checked in; the first depot is the default. */
export function DepotsCard({ canCreate }: { canCreate: boolean }) {
  const depots = useQuery(depotQueries.list());
  if (depots.isPending) return <PageSpinner label="Loading depots…" />;
  if (depots.isError) return <QueryErrorNotice error={depots.error} onRetry={() => void depots.refetch()} />;
  return (
    <div className="space-y-4">
      {depots.data.length === 0 ? (
        <p className="text-ink-muted">No depot yet: add one so kit has somewhere to be checked in to.</p>
      ) : (
        <ul aria-label="Depots" className="divide-y divide-line">
          {depots.data.map((depot, index) => (
            <li key={depot.id} className="py-2">
              <span className="font-semibold">{depot.name}</span>
              {index === 0 ? <span className="text-sm text-ink-muted"> · where check-ins go unless chosen</span> : null}
              {depot.notes ? <p className="text-sm text-ink-muted">{depot.notes}</p> : null}
            </li>
          ))}
        </ul>
      )}
      {canCreate ? <DepotForm /> : null}
    </div>
  );
}
