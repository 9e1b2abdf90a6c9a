import { useState } from 'react';
import {
  calendarDateIn,
  inhibitorCheck,
  inhibitorCheckVisitInputSchema,
  type CheckableInhibitor,
} from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { TextareaField } from '@/components/ui/textarea-field';
import { formatCalendarDate } from '@/lib/format';
import { textOrNull, useSchemaForm } from '@/lib/form';
import { useRecordSiteCheck } from '@/features/sites/api/use-record-site-check';
import { TopUpFields } from '@/features/sites/components/top-up-fields';

const fields = [
  'checkedOn',
  'inhibitorProductId',
  'inhibitorReading',
  'systemTdsPpm',
  'notes',
  'topUp.vanId',
  'topUp.packs',
  'retestReading',
  'emailCustomer',
] as const;

const numberOrUndefined = (v: string | undefined) => (v === undefined || v.trim() === '' ? undefined : Number(v));

function prepare(values: Record<string, string | undefined>) {
  return {
    checkedOn: values.checkedOn ?? '',
    inhibitorProductId: numberOrUndefined(values.inhibitorProductId),
    inhibitorReading: numberOrUndefined(values.inhibitorReading),
    systemTdsPpm: numberOrUndefined(values.systemTdsPpm) ?? null,
    notes: textOrNull(values.notes),
    // A top-up is sent when packs are given; the van is then required by the schema.
    topUp: values['topUp.packs']?.trim()
      ? { vanId: numberOrUndefined(values['topUp.vanId']), packs: numberOrUndefined(values['topUp.packs']) }
      : undefined,
    retestReading: numberOrUndefined(values.retestReading) ?? null,
    emailCustomer: values.emailCustomer === 'on',
  };
}

const unitOf = (p: CheckableInhibitor) => (p.targetUnit ? ` ${p.targetUnit}` : '');

/** The live verdict as the reading is typed: the same rule the API applies when the check is saved. */
function LiveResult({ product, reading }: { product: CheckableInhibitor | undefined; reading: string }) {
  const value = Number(reading);
  if (!product || reading.trim() === '' || Number.isNaN(value)) return null;
  const result = inhibitorCheck(value, { min: product.targetMin, max: product.targetMax });
  const range = `${product.targetMin} to ${product.targetMax}${unitOf(product)}`;
  return (
    <div aria-live="polite">
      {result === 'pass' ? (
        <Alert tone="success" title="Pass">
          {value}
          {unitOf(product)} is within {product.name}&apos;s target of {range}.
        </Alert>
      ) : (
        <Alert tone="error" title={`Fail: ${result === 'low' ? 'below' : 'above'} the target`}>
          {value}
          {unitOf(product)} is {result === 'low' ? 'below' : 'above'} {product.name}&apos;s target of {range}.{' '}
          {result === 'low'
            ? 'Top up the inhibitor as its label directs and test again.'
            : 'Check the reading; follow the product’s instructions.'}
        </Alert>
      )}
    </div>
  );
}

export function SiteCheckForm({
  siteId,
  inhibitors,
  timeZone,
}: {
  siteId: number;
  inhibitors: CheckableInhibitor[];
  timeZone: string;
}) {
  const record = useRecordSiteCheck(siteId);
  const form = useSchemaForm(inhibitorCheckVisitInputSchema, fields, prepare);
  const [retest, setRetest] = useState('');
  const [productId, setProductId] = useState(inhibitors.length === 1 ? String(inhibitors[0]!.id) : '');
  const [reading, setReading] = useState('');
  const product = inhibitors.find((p) => String(p.id) === productId);

  if (inhibitors.length === 0) {
    return (
      <Alert tone="info">
        No inhibitor has a target range yet. Set the target range on the inhibitor product in Stock, then record the
        check here.
      </Alert>
    );
  }
  return (
    <form
      ref={form.formRef}
      noValidate
      aria-label="Record an inhibitor check"
      className="space-y-4"
      onSubmit={form.handleSubmit((input) =>
        record.mutate(
          { input, idempotencyKey: crypto.randomUUID() },
          {
            onError: form.showError,
            onSuccess: () => {
              form.formRef.current?.reset();
              setReading('');
              setRetest('');
            },
          },
        ),
      )}
    >
      {form.formError ? <Alert tone="error">{form.formError}</Alert> : null}
      {record.isSuccess ? (
        <Alert
          tone={record.data.check.result === 'pass' ? 'success' : 'info'}
          title={`Check recorded: ${record.data.check.result === 'pass' ? 'pass' : 'fail'}${record.data.check.retestReading !== null ? ' on the re-test' : ''}`}
        >
          Next check due {record.data.site.nextCheckOn ? formatCalendarDate(record.data.site.nextCheckOn) : 'not set'}.
          {record.data.check.topUp
            ? ` ${record.data.check.topUp.packs} pack${record.data.check.topUp.packs === 1 ? '' : 's'} taken off ${record.data.check.topUp.van.name}.`
            : ''}
          {record.data.check.noteEmailed ? ' The customer has been e-mailed the result.' : ''}
        </Alert>
      ) : null}
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          label="Date of the check"
          name="checkedOn"
          type="date"
          defaultValue={calendarDateIn(new Date(), timeZone)}
          error={form.fieldErrors.checkedOn}
        />
        <SelectField
          label="Inhibitor in the system"
          name="inhibitorProductId"
          value={productId}
          onChange={(e) => setProductId(e.target.value)}
          options={[
            ...(inhibitors.length > 1 ? [{ value: '', label: 'Choose the inhibitor…' }] : []),
            ...inhibitors.map((p) => ({ value: String(p.id), label: p.name })),
          ]}
          error={form.fieldErrors.inhibitorProductId}
        />
        <TextField
          label={`Inhibitor reading${product ? ` (${product.targetUnit ?? 'the product’s unit'})` : ''}`}
          name="inhibitorReading"
          inputMode="decimal"
          autoComplete="off"
          value={reading}
          onChange={(e) => setReading(e.target.value)}
          hint={
            product
              ? `Target ${product.targetMin} to ${product.targetMax}${unitOf(product)}${product.testMethod ? `; ${product.testMethod}` : ''}.`
              : undefined
          }
          error={form.fieldErrors.inhibitorReading}
        />
        <TextField
          label="System water TDS (ppm), if taken"
          name="systemTdsPpm"
          inputMode="decimal"
          autoComplete="off"
          error={form.fieldErrors.systemTdsPpm}
        />
      </div>
      <LiveResult product={product} reading={reading} />
      {product &&
      reading.trim() !== '' &&
      inhibitorCheck(Number(reading), { min: product.targetMin, max: product.targetMax }) !== 'pass' ? (
        <TopUpFields product={product} retest={retest} onRetest={setRetest} errors={form.fieldErrors} />
      ) : null}
      <TextareaField label="Notes" name="notes" rows={3} error={form.fieldErrors.notes} />
      <label className="flex min-h-12 cursor-pointer items-center gap-3">
        <input type="checkbox" name="emailCustomer" defaultChecked className="size-6 accent-brand-700" />
        <span>E-mail the customer a short note of the result (when they have an address)</span>
      </label>
      <Button type="submit" busy={record.isPending} className="w-full sm:w-auto">
        Save the check
      </Button>
    </form>
  );
}
