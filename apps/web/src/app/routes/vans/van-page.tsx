import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { useParams } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { useAbility } from '@/lib/ability';
import { isApiError } from '@/lib/api-client';
import { useSignedInMe } from '@/lib/auth';
import { NotFoundPage } from '@/app/routes/not-found-page';
import { KitItemsList } from '@/features/kits/components/kit-items-list';
import { KitsTable } from '@/features/kits/components/kits-table';
import { vanQueries } from '@/features/vans/api/van-queries';
import { VanForm } from '@/features/vans/components/van-form';
import { VanSummary } from '@/features/vans/components/van-summary';
import { useEngineerOptions } from '@/app/routes/vans/use-engineer-options';

export function VanPage() {
  const me = useSignedInMe();
  const ability = useAbility();
  const id = Number(useParams().id);
  const detail = useQuery({ ...vanQueries.detail(id), enabled: Number.isInteger(id) && id > 0 });
  const canEdit = ability.can('update', 'Location');
  const engineers = useEngineerOptions(canEdit);
  const [editing, setEditing] = useState(false);

  if (!Number.isInteger(id) || id <= 0 || isApiError(detail.error, 404)) return <NotFoundPage />;
  if (detail.isPending) return <PageSpinner label="Loading the van…" />;
  if (detail.isError) return <QueryErrorNotice error={detail.error} onRetry={() => void detail.refetch()} />;

  const { van, kits, items } = detail.data;
  const loose = items.filter((item) => item.kit === null);
  return (
    <>
      <PageHeader title={van.name}>
        {van.registration}
        {van.engineer ? ` · ${van.engineer.name}` : ''}
      </PageHeader>
      <div className="space-y-5">
        <Card title="The van">
          {editing ? (
            <VanForm engineers={engineers} van={van} onSaved={() => setEditing(false)} />
          ) : (
            <div className="space-y-4">
              <VanSummary van={van} timeZone={me.activeFirm.timeZone} />
              {canEdit ? (
                <Button variant="secondary" onClick={() => setEditing(true)}>
                  Edit van
                </Button>
              ) : null}
            </div>
          )}
        </Card>
        <Card title="Kits on board">
          <KitsTable kits={kits} caption={`Kits on ${van.name}`} />
        </Card>
        <Card
          title="Items on board"
          description={loose.length > 0 ? `${loose.length} of them loose, not in a kit.` : undefined}
        >
          <KitItemsList items={items} caption={`Items on ${van.name}`} />
        </Card>
      </div>
    </>
  );
}
