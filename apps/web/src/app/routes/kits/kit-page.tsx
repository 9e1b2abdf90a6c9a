import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { Link, useParams } from 'react-router-dom';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { Button, buttonClasses } from '@/components/ui/button';
import { useAbility } from '@/lib/ability';
import { KitEditForm } from '@/features/kits/components/kit-edit-form';
import { paths } from '@/config/paths';
import { useSignedInMe } from '@/lib/auth';
import { NotFoundPage } from '@/app/routes/not-found-page';
import { isApiError } from '@/lib/api-client';
import { kitQueries } from '@/features/kits/api/kit-queries';
import { CustodyPanel } from '@/features/kits/components/custody-panel';
import { CustodyTimeline } from '@/features/kits/components/custody-timeline';
import { InspectionStateBadge } from '@/features/kits/components/inspection-state';
import { InspectionsList } from '@/features/kits/components/inspections-list';
import { KitItemsList } from '@/features/kits/components/kit-items-list';
import { useFleetPlaces } from '@/app/routes/kits/use-fleet-places';

export function KitPage() {
  const me = useSignedInMe();
  const id = Number(useParams().id);
  const detail = useQuery({ ...kitQueries.detail(id), enabled: Number.isInteger(id) && id > 0 });
  const fleet = useFleetPlaces();
  const ability = useAbility();
  const [editing, setEditing] = useState(false);

  if (!Number.isInteger(id) || id <= 0 || isApiError(detail.error, 404)) return <NotFoundPage />;
  if (detail.isPending) return <PageSpinner label="Loading the kit…" />;
  if (detail.isError) return <QueryErrorNotice error={detail.error} onRetry={() => void detail.refetch()} />;

  const { kit, items, events, inspections } = detail.data;
  const assetTags = new Map(items.map((item) => [item.id, item.assetTag]));
  return (
    <>
      <PageHeader title={kit.name}>
        <span className="inline-flex flex-wrap items-center gap-2">
          {kit.itemCount} item{kit.itemCount === 1 ? '' : 's'} · <InspectionStateBadge state={kit.inspectionState} />
        </span>
      </PageHeader>
      <div className="space-y-5">
        {fleet.isPending ? (
          <PageSpinner label="Loading vans…" />
        ) : (
          <CustodyPanel
            firmId={me.activeFirm.id}
            targets={{ kit: { id: kit.id, name: kit.name, itemCount: kit.itemCount }, item: null }}
            location={kit.location}
            vans={fleet.vans}
            depots={fleet.depots}
            items={items}
          />
        )}
        <Card title="Items">
          <KitItemsList items={items} caption={`Items in ${kit.name}`} />
          <Link to={paths.labels.getHref({ kitId: kit.id })} className={buttonClasses('secondary', 'mt-4')}>
            Print labels for this kit
          </Link>
        </Card>
        <Card title="Custody timeline" description="Newest first. Nothing here is ever changed after the fact.">
          <CustodyTimeline events={events} timeZone={me.activeFirm.timeZone} groupByKit />
        </Card>
        <Card title="Inspections">
          <InspectionsList inspections={inspections} assetTags={assetTags} />
        </Card>
        {editing ? (
          <Card title="Edit kit">
            <KitEditForm kit={kit} onDone={() => setEditing(false)} />
          </Card>
        ) : kit.notes || ability.can('update', 'Kit') ? (
          <Card title="Notes">
            {kit.notes ? (
              <p className="whitespace-pre-line">{kit.notes}</p>
            ) : (
              <p className="text-ink-muted">No notes.</p>
            )}
            {ability.can('update', 'Kit') ? (
              <Button variant="secondary" className="mt-4" onClick={() => setEditing(true)}>
                Edit kit
              </Button>
            ) : null}
          </Card>
        ) : null}
      </div>
    </>
  );
}
