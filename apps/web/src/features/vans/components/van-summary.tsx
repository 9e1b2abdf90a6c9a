import type { Van } from '@heatfleet/domain';
import { VanDueDate } from '@/features/vans/components/van-due';

/** The facts an engineer or the office checks first: who drives it and when it is due at the garage. */
export function VanSummary({ van, timeZone }: { van: Van; timeZone: string }) {
  return (
    <dl className="grid gap-x-6 gap-y-3 sm:grid-cols-2">
      <div>
        <dt className="text-sm font-semibold text-ink-muted">Registration</dt>
        <dd className="font-mono text-lg">{van.registration}</dd>
      </div>
      <div>
        <dt className="text-sm font-semibold text-ink-muted">Engineer</dt>
        <dd>{van.engineer?.name ?? 'Nobody yet'}</dd>
      </div>
      <div>
        <dt className="text-sm font-semibold text-ink-muted">MOT</dt>
        <dd>
          <VanDueDate label="MOT" date={van.motDueOn} timeZone={timeZone} />
        </dd>
      </div>
      <div>
        <dt className="text-sm font-semibold text-ink-muted">Service</dt>
        <dd>
          <VanDueDate label="Service" date={van.serviceDueOn} timeZone={timeZone} />
        </dd>
      </div>
      {van.notes ? (
        <div className="sm:col-span-2">
          <dt className="text-sm font-semibold text-ink-muted">Notes</dt>
          <dd className="whitespace-pre-line">{van.notes}</dd>
        </div>
      ) : null}
      {van.active ? null : (
        <div className="sm:col-span-2">
          <dd className="font-semibold text-danger-700">This van is no longer in use.</dd>
        </div>
      )}
    </dl>
  );
}
