import { subject } from '@casl/ability';
import type { AppAbility } from '@heatfleet/domain';
import { isApiError } from '@/lib/api-client';
import { queuedMessage, type WriteOutcome } from '@/lib/offline/queue-write';
import { ChoiceGroup } from '@/components/ui/choice-group';
import type { CustodyScope } from '@/features/kits/api/use-custody';

/** A van as custody needs it; the route builds these from the vans list. */
export interface CustodyVan {
  id: number;
  name: string;
  registration: string;
  engineerMemberId: number | null;
  engineerName: string | null;
}

export interface CustodyDepot {
  id: number;
  name: string;
}

export function vanLabel(van: CustodyVan): string {
  return `${van.name} (${van.registration})${van.engineerName ? `, ${van.engineerName}` : ''}`;
}

/** Whether this member may check kit out to, in from, or on from this van: the same rule the API applies. */
export function canHandleVan(ability: AppAbility, firmId: number, van: CustodyVan): boolean {
  return ability.can(
    'create',
    subject('Custody', { firmId, kind: 'van' as const, engineerMemberId: van.engineerMemberId }),
  );
}

/** What a custody form acts on: a kit, or one item which may belong to a kit. */
export interface CustodyTargets {
  /** itemCount is left out where it is not known (an item's page). */
  kit: { id: number; name: string; itemCount?: number } | null;
  item: { id: number; assetTag: string } | null;
}

export function defaultScope(targets: CustodyTargets): CustodyScope {
  if (targets.kit) return { kind: 'kit', id: targets.kit.id };
  return { kind: 'item', id: targets.item!.id };
}

/** On an item's page, when the item belongs to a kit: move the whole kit (the usual case) or only this item. */
export function ScopeChoice({
  targets,
  scope,
  onChange,
}: {
  targets: CustodyTargets;
  scope: CustodyScope;
  onChange: (scope: CustodyScope) => void;
}) {
  const { kit, item } = targets;
  if (!kit || !item) return null;
  return (
    <ChoiceGroup
      legend="What goes"
      name="scope"
      columns={2}
      value={scope.kind}
      onChange={(value) => onChange(value === 'kit' ? { kind: 'kit', id: kit.id } : { kind: 'item', id: item.id })}
      options={[
        {
          value: 'kit',
          label: `The whole kit, ${kit.name}`,
          hint:
            kit.itemCount === undefined
              ? 'All its items travel together'
              : `${kit.itemCount} item${kit.itemCount === 1 ? '' : 's'} travel together`,
        },
        { value: 'item', label: `Only ${item.assetTag}`, hint: 'The rest of the kit stays where it is' },
      ]}
    />
  );
}

export function isInspectionOverdue(error: unknown): boolean {
  return isApiError(error, 409) && error.code === 'InspectionOverdue';
}

/** How a custody form tells its panel it is done: at once, or kept on the phone with the message for when it goes. */
export type CustodyFinish = (message: string, whenSent?: Promise<string | null>) => void;

export function reportOutcome(outcome: WriteOutcome, success: string, what: string, finish: CustodyFinish): void {
  if (outcome.status === 'sent') return finish(success);
  finish(
    queuedMessage(what, outcome.why),
    outcome.settled.then((settled) => (settled === 'sent' ? success : null)),
  );
}

/** The draft of one custody form for this kit or item (lib/offline/use-form-draft.ts). */
export function custodyDraftKey(targets: CustodyTargets, action: string): string {
  return `custody:${targets.kit?.id ?? '-'}:${targets.item?.id ?? '-'}:${action}`;
}
