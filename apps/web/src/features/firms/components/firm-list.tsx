import { roleLabels, type Me } from '@heatfleet/domain';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { useSetActiveFirm } from '@/features/firms/api/use-set-active-firm';
import { CreateFirmForm } from '@/features/firms/components/create-firm-form';

export function FirmList({ me }: { me: Me }) {
  const setActiveFirm = useSetActiveFirm();
  return (
    <div className="space-y-3">
      {setActiveFirm.isError ? <Alert tone="error">{setActiveFirm.error.message}</Alert> : null}
      <ul className="divide-y divide-line">
        {me.memberships.map((membership) => {
          const active = membership.firmId === me.activeFirm.id;
          return (
            <li key={membership.firmId} className="flex flex-wrap items-center justify-between gap-2 py-2">
              <div className="min-w-0">
                <p className="font-semibold [overflow-wrap:anywhere]">{membership.firmName}</p>
                <p className="text-sm text-ink-muted">{roleLabels[membership.role]}</p>
              </div>
              {active ? (
                <span className="rounded-full bg-brand-100 px-3 py-1 text-sm font-semibold text-brand-800">
                  Working in now
                </span>
              ) : (
                <Button
                  variant="secondary"
                  busy={setActiveFirm.isPending && setActiveFirm.variables === membership.firmId}
                  onClick={() => setActiveFirm.mutate(membership.firmId)}
                >
                  Switch to this firm
                </Button>
              )}
            </li>
          );
        })}
      </ul>
      <CreateFirmForm />
    </div>
  );
}
