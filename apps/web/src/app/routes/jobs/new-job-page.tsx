import { useQuery } from '@tanstack/react-query';
import { calendarDateIn } from '@heatfleet/domain';
import { PageHeader } from '@/components/ui/page-header';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { useAbility } from '@/lib/ability';
import { useSignedInMe } from '@/lib/auth';
import { NewJobForm, type EngineerChoice } from '@/features/jobs/components/new-job-form';
import { productQueries } from '@/features/stock/api/stock-queries';
import { memberQueries } from '@/features/team/api/member-queries';

export function NewJobPage() {
  const me = useSignedInMe();
  const ability = useAbility();
  const products = useQuery(productQueries.list());
  const members = useQuery({ ...memberQueries.list(), enabled: ability.can('read', 'Member') });
  if (products.isPending) return <PageSpinner label="Loading products…" />;
  if (products.isError) return <QueryErrorNotice error={products.error} onRetry={() => void products.refetch()} />;
  const doseProducts = products.data.filter((p) => p.active && (p.kind === 'cleaner' || p.kind === 'inhibitor'));
  // An engineer books for themself only; the office names one of the firm's active engineers (the API holds the same rule).
  const engineers: EngineerChoice[] =
    me.role === 'engineer'
      ? [{ memberId: me.memberId, name: `${me.user.name} (me)` }]
      : (members.data ?? [])
          .filter((m) => m.active && m.role === 'engineer')
          .sort((a, b) => a.name.localeCompare(b.name))
          .map((m) => ({ memberId: m.id, name: m.name }));
  return (
    <>
      <PageHeader title="Book a job">The survey, with the system volume and doses worked out as you type.</PageHeader>
      <NewJobForm
        products={doseProducts}
        engineers={engineers}
        defaultEngineerId={me.role === 'engineer' ? me.memberId : null}
        today={calendarDateIn(new Date(), me.activeFirm.timeZone)}
      />
    </>
  );
}
