import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { Can, useAbility } from '@/lib/ability';
import { useSignedInMe } from '@/lib/auth';
import { DepotsCard } from '@/features/vans/components/depots-card';
import { VanForm } from '@/features/vans/components/van-form';
import { VansTable } from '@/features/vans/components/vans-table';
import { useEngineerOptions } from '@/app/routes/vans/use-engineer-options';

export function VansPage() {
  const me = useSignedInMe();
  const ability = useAbility();
  const engineers = useEngineerOptions(ability.can('create', 'Location'));
  return (
    <>
      <PageHeader title="Vans">Who drives which van, what is on board and when it is due at the garage.</PageHeader>
      <div className="space-y-5">
        <Card title="Vans">
          <VansTable timeZone={me.activeFirm.timeZone} />
        </Card>
        <Can I="create" a="Location">
          <Card title="New van">
            <VanForm engineers={engineers} />
          </Card>
        </Can>
        <Card title="Depots">
          <DepotsCard canCreate={ability.can('create', 'Location')} />
        </Card>
      </div>
    </>
  );
}
