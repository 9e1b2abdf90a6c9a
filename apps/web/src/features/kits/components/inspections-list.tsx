import type { Inspection } from '@heatfleet/domain';
import { Badge } from '@/components/ui/badge';
import { formatCalendarDate } from '@/lib/format';

export function InspectionsList({
  inspections,
  assetTags,
}: {
  inspections: Inspection[];
  assetTags?: Map<number, string>;
}) {
  const sorted = [...inspections].sort((a, b) => b.inspectedOn.localeCompare(a.inspectedOn) || b.id - a.id);
  if (sorted.length === 0) return <p className="text-ink-muted">No inspections recorded yet.</p>;
  return (
    <ul aria-label="Inspections" className="divide-y divide-line">
      {sorted.map((inspection) => (
        <li key={inspection.id} className="py-3">
          <p className="flex flex-wrap items-center gap-2">
            <Badge tone={inspection.result === 'passed' ? 'ok' : 'danger'}>
              {inspection.result === 'passed' ? 'Passed' : 'Failed'}
            </Badge>
            <span className="font-semibold">{formatCalendarDate(inspection.inspectedOn)}</span>
            <span className="text-sm text-ink-muted">by {inspection.byName}</span>
            {assetTags?.get(inspection.itemId) ? (
              <span className="font-mono text-sm">{assetTags.get(inspection.itemId)}</span>
            ) : null}
          </p>
          {inspection.cleanedAtCheckIn ? <p className="mt-1 text-sm">Cleaned after use, ticked at check-in</p> : null}
          {inspection.electrical ? (
            <p className="mt-1 text-sm">
              Electrical test (Class {inspection.electrical.equipmentClass}):{' '}
              {inspection.electrical.result === 'pass' ? 'passed' : inspection.electrical.failures.join(' ')}
              {inspection.electrical.earthContinuityOhms !== null
                ? ` · earth ${inspection.electrical.earthContinuityOhms} Ω (limit ${inspection.electrical.earthLimitOhms} Ω)`
                : ''}
              {inspection.electrical.insulationResistanceMohms !== null
                ? ` · insulation ${inspection.electrical.insulationResistanceMohms} MΩ (min ${inspection.electrical.insulationMinMohms} MΩ)`
                : ''}
              {` · tester ${inspection.electrical.testerUsed}, calibrated ${formatCalendarDate(inspection.electrical.testerCalibratedOn)}`}
            </p>
          ) : null}
          {inspection.notes ? <p className="mt-1 text-sm whitespace-pre-line">{inspection.notes}</p> : null}
          {inspection.photoId ? (
            <a
              href={`/api/photos/${inspection.photoId}/content`}
              target="_blank"
              rel="noreferrer"
              className="text-sm text-brand-700 underline"
            >
              Photo
            </a>
          ) : null}
        </li>
      ))}
    </ul>
  );
}
