import { useQuery } from '@tanstack/react-query';
import { useAbility } from '@/lib/ability';
import { useSignedInMe } from '@/lib/auth';
import { firmSettingsQueries } from '@/features/firms/api/firm-settings-queries';
import type { EngineerChoice } from '@/features/jobs/components/job-form';
import { productQueries, stockQueries } from '@/features/stock/api/stock-queries';
import { memberQueries } from '@/features/team/api/member-queries';

/** What the booking form offers, from three features: the products to dose, the engineers, the firm's defaults. */
export function useBookingChoices() {
  const me = useSignedInMe();
  const ability = useAbility();
  const products = useQuery(productQueries.list());
  const members = useQuery({ ...memberQueries.list(), enabled: ability.can('read', 'Member') });
  const firm = useQuery(firmSettingsQueries.detail());
  // An engineer books for their own van, so the plan can say whether it holds the packs.
  const myVan = useQuery({ ...stockQueries.mine(), enabled: me.role === 'engineer' });
  // An engineer books for themself only; the office names one of the firm's active engineers (the API holds the same rule).
  const engineers: EngineerChoice[] =
    me.role === 'engineer'
      ? [{ memberId: me.memberId, name: `${me.user.name} (me)` }]
      : (members.data ?? [])
          .filter((m) => m.active && m.role === 'engineer')
          .sort((a, b) => a.name.localeCompare(b.name))
          .map((m) => ({ memberId: m.id, name: m.name }));
  return {
    products,
    doseProducts: (products.data ?? []).filter((p) => p.active && (p.kind === 'cleaner' || p.kind === 'inhibitor')),
    engineers,
    // Until the firm's settings load, the API's own defaults still apply when the job is saved.
    heatExchangerDefaults: firm.data?.heatExchangerDefaults ?? null,
    ownDefaults: firm.data?.heatExchangerDefaultsOwn ?? false,
    firmPending: firm.isPending,
    vanStock: myVan.data?.van
      ? { vanName: myVan.data.van.name, usable: new Map(myVan.data.stock.map((c) => [c.productId, c.usable])) }
      : null,
  };
}
