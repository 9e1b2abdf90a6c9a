import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { Link, useParams } from 'react-router-dom';
import { itemConditionLabels } from '@heatfleet/domain';
import { Button, buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';
import { paths } from '@/config/paths';
import { Can, useAbility } from '@/lib/ability';
import { isApiError } from '@/lib/api-client';
import { useSignedInMe } from '@/lib/auth';
import { formatCalendarDate } from '@/lib/format';
import { NotFoundPage } from '@/app/routes/not-found-page';
import { kitItemQueries, kitQueries } from '@/features/kits/api/kit-queries';
import { CustodyPanel } from '@/features/kits/components/custody-panel';
import { CustodyTimeline } from '@/features/kits/components/custody-timeline';
import { describeDue, InspectionStateBadge } from '@/features/kits/components/inspection-state';
import { InspectionForm } from '@/features/kits/components/inspection-form';
import { KitItemEditForm } from '@/features/kits/components/kit-item-edit-form';
import { InspectionsList } from '@/features/kits/components/inspections-list';
import { PhotoGallery } from '@/features/kits/components/photo-gallery';
import { useFleetPlaces } from '@/app/routes/kits/use-fleet-places';

/** Where a QR label lands: the custody buttons come first, before anything else on the page. */
export function KitItemPage() {
  const me = useSignedInMe();
  const id = Number(useParams().id);
  const detail = useQuery({ ...kitItemQueries.detail(id), enabled: Number.isInteger(id) && id > 0 });
  // The item's kit with all its items: checking the whole kit in from this label asks each item's condition.
  const kitId = detail.data?.item.kit?.id;
  const kit = useQuery({ ...kitQueries.detail(kitId ?? 0), enabled: kitId !== undefined });
  const fleet = useFleetPlaces();
  const ability = useAbility();
  const [editing, setEditing] = useState(false);

  if (!Number.isInteger(id) || id <= 0 || isApiError(detail.error, 404)) return <NotFoundPage />;
  if (detail.isPending) return <PageSpinner label="Loading the item…" />;
  if (detail.isError) return <QueryErrorNotice error={detail.error} onRetry={() => void detail.refetch()} />;

  const { item, events, inspections, photos } = detail.data;
  return (
    <>
      <PageHeader title={item.assetTag}>
        {item.kind.name}
        {item.kit ? (
          <>
            {' '}
            in{' '}
            <Link to={paths.kit.getHref(item.kit.id)} className="font-semibold text-brand-700 underline">
              {item.kit.name}
            </Link>
          </>
        ) : (
          ' (loose)'
        )}
      </PageHeader>
      <div className="space-y-5">
        {/* Without signal the kit's query pauses: the panel then goes on with this item alone, never waits. */}
        {fleet.isPending || (kit.isPending && kit.fetchStatus === 'fetching') ? (
          <PageSpinner label="Loading vans…" />
        ) : (
          <CustodyPanel
            firmId={me.activeFirm.id}
            targets={{ kit: item.kit, item: { id: item.id, assetTag: item.assetTag } }}
            location={item.location}
            vans={fleet.vans}
            depots={fleet.depots}
            items={kit.data?.items ?? [item]}
          />
        )}
        <Card title="Inspection">
          <p className="flex flex-wrap items-center gap-2">
            <InspectionStateBadge state={item.inspection.state} />
            <span>{describeDue(item.inspection)}</span>
          </p>
          <p className="mt-1 text-sm text-ink-muted">
            {item.inspection.lastInspectedOn
              ? `Last inspected ${formatCalendarDate(item.inspection.lastInspectedOn)}. `
              : 'Never inspected. '}
            {item.inspection.usesSinceInspection} use{item.inspection.usesSinceInspection === 1 ? '' : 's'} since.
          </p>
        </Card>
        <Card title="Details">
          {editing ? (
            <KitItemEditForm item={item} onDone={() => setEditing(false)} />
          ) : (
            <>
              <dl className="grid gap-x-6 gap-y-3 sm:grid-cols-2">
                <div>
                  <dt className="text-sm font-semibold text-ink-muted">Condition</dt>
                  <dd className={item.condition === 'in_service' ? '' : 'font-semibold text-ember-700'}>
                    {itemConditionLabels[item.condition]}
                  </dd>
                </div>
                <div>
                  <dt className="text-sm font-semibold text-ink-muted">Serial number</dt>
                  <dd>{item.serialNumber ?? 'Not recorded'}</dd>
                </div>
                {item.vibrationMs2 != null ? (
                  <div>
                    <dt className="text-sm font-semibold text-ink-muted">Vibration magnitude</dt>
                    <dd>{item.vibrationMs2} m/s² (counts towards the hand-arm vibration points of each agitation)</dd>
                  </div>
                ) : null}
                {item.notes ? (
                  <div className="sm:col-span-2">
                    <dt className="text-sm font-semibold text-ink-muted">Notes</dt>
                    <dd className="whitespace-pre-line">{item.notes}</dd>
                  </div>
                ) : null}
              </dl>
              <div className="mt-4 flex flex-wrap gap-2">
                <Link to={paths.labels.getHref({ ids: [item.id] })} className={buttonClasses('secondary')}>
                  Print its label
                </Link>
                {ability.can('update', 'KitItem') ? (
                  <Button variant="secondary" onClick={() => setEditing(true)}>
                    Edit details
                  </Button>
                ) : null}
              </div>
            </>
          )}
        </Card>
        <Card title="Custody timeline" description="Newest first.">
          <CustodyTimeline events={events} timeZone={me.activeFirm.timeZone} />
        </Card>
        <Card title="Inspections">
          <div className="space-y-5">
            <InspectionsList inspections={inspections} />
            <Can I="create" a="Inspection">
              <div className="border-t border-line pt-4">
                <h3 className="mb-3 font-bold text-brand-900">Record an inspection</h3>
                <InspectionForm itemId={item.id} timeZone={me.activeFirm.timeZone} />
              </div>
            </Can>
          </div>
        </Card>
        <Card title="Photos">
          <PhotoGallery photos={photos} alt={`Photo of ${item.assetTag}`} />
        </Card>
      </div>
    </>
  );
}
