import { inspectionStateLabels, type KitItem } from '@heatfleet/domain';
import { Badge, type BadgeTone } from '@/components/ui/badge';
import { formatCalendarDate } from '@/lib/format';

type InspectionState = keyof typeof inspectionStateLabels;

const tones: Record<InspectionState, BadgeTone> = { no_rule: 'neutral', ok: 'ok', due_soon: 'warn', overdue: 'danger' };

export function InspectionStateBadge({ state }: { state: InspectionState }) {
  return <Badge tone={tones[state]}>{inspectionStateLabels[state]}</Badge>;
}

/** "Due 3 Jan 2027" or "2 uses left": whichever makes the item due first, as the rule says. */
export function describeDue(inspection: KitItem['inspection']): string {
  if (inspection.state === 'no_rule') return 'No inspection rule for this kind.';
  const parts: string[] = [];
  if (inspection.dueOn)
    parts.push(
      `${inspection.state === 'overdue' && inspection.reason === 'days' ? 'was due' : 'due'} ${formatCalendarDate(inspection.dueOn)}`,
    );
  if (inspection.usesLeft !== null)
    parts.push(
      inspection.usesLeft === 0
        ? 'no uses left'
        : `${inspection.usesLeft} use${inspection.usesLeft === 1 ? '' : 's'} left`,
    );
  const text = parts.join(' or ');
  return text.charAt(0).toUpperCase() + text.slice(1) + '.';
}

export function ItemDue({ item }: { item: KitItem }) {
  return (
    <span className="inline-flex flex-wrap items-center gap-x-2 gap-y-1 max-sm:justify-end">
      <InspectionStateBadge state={item.inspection.state} />
      {item.inspection.state === 'no_rule' ? null : (
        <span className="text-sm text-ink-muted">{describeDue(item.inspection)}</span>
      )}
    </span>
  );
}
