import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { itemKindInputSchema, overduePolicies, overduePolicyLabels, type ItemKind } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { useSchemaForm } from '@/lib/form';
import { itemKindQueries } from '@/features/kits/api/kit-queries';
import { useSaveItemKind } from '@/features/kits/api/use-save-item-kind';

const fields = ['name', 'intervalDays', 'intervalUses', 'dueSoonDays', 'overduePolicy', 'electrical'] as const;

function numberOrNull(value: string | undefined): number | null {
  return value && value.trim() !== '' ? Number(value) : null;
}

function prepare(values: Record<string, string | undefined>) {
  return {
    name: values.name,
    intervalDays: numberOrNull(values.intervalDays),
    intervalUses: numberOrNull(values.intervalUses),
    dueSoonDays: numberOrNull(values.dueSoonDays) ?? 0,
    overduePolicy: values.overduePolicy,
    electrical: values.electrical === 'on',
  };
}

export function describeRule(kind: ItemKind): string {
  const parts: string[] = [];
  if (kind.intervalDays) parts.push(`every ${kind.intervalDays} days`);
  if (kind.intervalUses) parts.push(`after ${kind.intervalUses} use${kind.intervalUses === 1 ? '' : 's'}`);
  if (parts.length === 0) return 'No inspection rule';
  const first = parts.length > 1 ? ', whichever comes first' : '';
  return `Inspect ${parts.join(' or ')}${first}; due soon ${kind.dueSoonDays} day${kind.dueSoonDays === 1 ? '' : 's'} ahead`;
}

function ItemKindForm({ kind, onDone }: { kind?: ItemKind; onDone: () => void }) {
  const save = useSaveItemKind();
  const form = useSchemaForm(itemKindInputSchema, fields, prepare);
  return (
    <form
      ref={form.formRef}
      noValidate
      aria-label={kind ? `Edit ${kind.name}` : 'New item kind'}
      className="space-y-4"
      onSubmit={form.handleSubmit((input) =>
        save.mutate(
          { ...(kind ? { id: kind.id } : {}), input },
          {
            onError: form.showError,
            onSuccess: () => {
              form.formRef.current?.reset();
              onDone();
            },
          },
        ),
      )}
    >
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      <div className="grid gap-4 sm:grid-cols-3">
        <TextField
          label="Kind name"
          name="name"
          defaultValue={kind?.name}
          autoComplete="off"
          error={form.fieldErrors.name}
        />
        <TextField
          label="Inspect every N days"
          name="intervalDays"
          type="number"
          inputMode="numeric"
          min={1}
          defaultValue={kind?.intervalDays ?? ''}
          hint="Leave empty if time does not matter"
          error={form.fieldErrors.intervalDays}
        />
        <TextField
          label="Inspect after N uses"
          name="intervalUses"
          type="number"
          inputMode="numeric"
          min={1}
          defaultValue={kind?.intervalUses ?? ''}
          hint="Each check-in counts as a use"
          error={form.fieldErrors.intervalUses}
        />
        <TextField
          label="Due soon, days ahead"
          name="dueSoonDays"
          type="number"
          inputMode="numeric"
          min={0}
          defaultValue={kind?.dueSoonDays ?? 14}
          error={form.fieldErrors.dueSoonDays}
        />
        <SelectField
          label="When overdue"
          name="overduePolicy"
          defaultValue={kind?.overduePolicy ?? 'allow_with_reason'}
          options={overduePolicies.map((p) => ({ value: p, label: overduePolicyLabels[p] }))}
          error={form.fieldErrors.overduePolicy}
        />
        <label className="flex min-h-12 items-center gap-3 self-end font-semibold">
          <input
            type="checkbox"
            name="electrical"
            defaultChecked={kind?.electrical ?? false}
            className="size-5 accent-brand-700"
          />
          Electrical (tested on the firm&apos;s schedule)
        </label>
      </div>
      <div className="flex flex-wrap gap-2">
        <Button type="submit" busy={save.isPending}>
          {kind ? 'Save kind' : 'Add kind'}
        </Button>
        {kind ? (
          <Button variant="secondary" onClick={onDone}>
            Cancel
          </Button>
        ) : null}
      </div>
    </form>
  );
}

/** Item kinds and their inspection rules; a changed rule moves every due date of that kind. */
export function ItemKindsEditor() {
  const kinds = useQuery(itemKindQueries.list());
  const [editing, setEditing] = useState<number | null>(null);
  if (kinds.isPending) return <PageSpinner label="Loading item kinds…" />;
  if (kinds.isError) return <QueryErrorNotice error={kinds.error} onRetry={() => void kinds.refetch()} />;
  return (
    <div className="space-y-6">
      <ul className="divide-y divide-line" aria-label="Item kinds">
        {kinds.data.map((kind) => (
          <li key={kind.id} className="py-3">
            {editing === kind.id ? (
              <ItemKindForm kind={kind} onDone={() => setEditing(null)} />
            ) : (
              <div className="flex flex-wrap items-center justify-between gap-3">
                <div className="min-w-0">
                  <p className="font-semibold">{kind.name}</p>
                  <p className="text-sm text-ink-muted">
                    {describeRule(kind)}. {overduePolicyLabels[kind.overduePolicy]}.
                    {kind.electrical ? ' Electrical.' : ''}
                  </p>
                </div>
                <Button variant="secondary" onClick={() => setEditing(kind.id)}>
                  Edit<span className="sr-only"> {kind.name}</span>
                </Button>
              </div>
            )}
          </li>
        ))}
      </ul>
      <div>
        <h3 className="mb-3 font-bold text-brand-900">Add a kind</h3>
        <ItemKindForm onDone={() => undefined} />
      </div>
    </div>
  );
}
