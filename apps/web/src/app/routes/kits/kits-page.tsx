import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { Can } from '@/lib/ability';
import { useSignedInMe } from '@/lib/auth';
import { KitForm } from '@/features/kits/components/kit-form';
import { KitItemForm } from '@/features/kits/components/kit-item-form';
import { KitItemsTable } from '@/features/kits/components/kit-items-table';
import { KitsTable } from '@/features/kits/components/kits-table';
import { useFleetPlaces } from '@/app/routes/kits/use-fleet-places';

export function KitsPage() {
  const me = useSignedInMe();
  const fleet = useFleetPlaces();
  return (
    <>
      <PageHeader title="Kits">Every kit and item in {me.activeFirm.name}, where it is and what is due.</PageHeader>
      <div className="space-y-5">
        <Card title="Kits">
          <KitsTable />
        </Card>
        <Card title="Items" description="Filtered and paged on the server; scan a label to go straight to an item.">
          <KitItemsTable places={fleet.places} />
        </Card>
        <Can I="create" a="Kit">
          <Card title="New kit">
            <KitForm />
          </Card>
        </Can>
        <Can I="create" a="KitItem">
          <Card title="New item" description="After adding it, print its label and stick it on.">
            <KitItemForm places={fleet.places} />
          </Card>
        </Can>
      </div>
    </>
  );
}
