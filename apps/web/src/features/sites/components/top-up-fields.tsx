import { subject } from '@casl/ability';
import { useQuery } from '@tanstack/react-query';
import { inhibitorCheck, MAX_TOP_UP_PACKS, type CheckableInhibitor } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { useAbility } from '@/lib/ability';
import { useSignedInMe } from '@/lib/auth';
import { siteQueries } from '@/features/sites/api/site-queries';

/**
 * Topping up and testing again in the same visit: the packs come off a van's stock (an engineer's own van
 * only, as the API allows), and the re-test's reading decides the visit.
 */
export function TopUpFields({
  product,
  retest,
  onRetest,
  errors,
}: {
  product: CheckableInhibitor | undefined;
  retest: string;
  onRetest: (value: string) => void;
  errors: Record<string, string | undefined>;
}) {
  const me = useSignedInMe();
  const ability = useAbility();
  const vans = useQuery(siteQueries.topUpVans());
  const mine = (vans.data ?? []).filter(
    (v) =>
      v.active &&
      ability.can(
        'create',
        subject('StockUse', {
          firmId: me.activeFirm.id,
          kind: 'van' as const,
          engineerMemberId: v.engineer?.memberId ?? null,
        }),
      ),
  );
  const value = Number(retest);
  const result =
    product && retest.trim() !== '' && !Number.isNaN(value)
      ? inhibitorCheck(value, { min: product.targetMin, max: product.targetMax })
      : null;
  return (
    <fieldset className="space-y-3 rounded-lg border border-line p-3">
      <legend className="px-1 font-semibold">Top up and test again (optional)</legend>
      <p className="text-sm text-ink-muted">
        Add the inhibitor as its label directs, let it circulate, then test again. The packs come off the van.
      </p>
      <div className="grid gap-4 sm:grid-cols-3">
        <SelectField
          label="From van"
          name="topUp.vanId"
          defaultValue={mine.length === 1 ? String(mine[0]!.id) : ''}
          key={mine.length}
          options={[
            ...(mine.length === 1 ? [] : [{ value: '', label: 'Choose the van…' }]),
            ...mine.map((v) => ({ value: String(v.id), label: `${v.name} (${v.registration})` })),
          ]}
          error={errors['topUp.vanId']}
        />
        <TextField
          label="Packs added"
          name="topUp.packs"
          inputMode="numeric"
          autoComplete="off"
          hint={`Whole packs, up to ${MAX_TOP_UP_PACKS}.`}
          error={errors['topUp.packs']}
        />
        <TextField
          label="Re-test reading"
          name="retestReading"
          inputMode="decimal"
          autoComplete="off"
          value={retest}
          onChange={(e) => onRetest(e.target.value)}
          error={errors.retestReading}
        />
      </div>
      {result ? (
        <div aria-live="polite">
          <Alert
            tone={result === 'pass' ? 'success' : 'error'}
            title={result === 'pass' ? 'Re-test: pass' : 'Re-test: fail'}
          >
            {result === 'pass'
              ? 'The visit passes: the next check falls a year on.'
              : 'Still outside the target: the next check falls a month on.'}
          </Alert>
        </div>
      ) : null}
    </fieldset>
  );
}
