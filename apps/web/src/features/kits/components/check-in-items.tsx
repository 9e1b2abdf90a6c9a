import {
  itemConditionLabels,
  itemConditions,
  type CheckInItem,
  type ItemCondition,
  type KitItem,
} from '@heatfleet/domain';

/** Each item's own condition (in service unless changed) and, for kinds inspected after use, the cleaned tick. */
export type CheckInItemState = Record<number, { condition: ItemCondition; cleaned: boolean }>;

export function initialItemStates(items: KitItem[]): CheckInItemState {
  return Object.fromEntries(items.map((i) => [i.id, { condition: 'in_service', cleaned: false }]));
}

/** What the check-in sends for the items in scope. */
export function checkInItems(items: KitItem[], states: CheckInItemState): CheckInItem[] {
  return items.map((i) => {
    const s = states[i.id] ?? { condition: 'in_service', cleaned: false };
    return { itemId: i.id, condition: s.condition, ...(hasUseRule(i) && s.cleaned && { cleaned: true }) };
  });
}

/** A kind with a use rule (a magnet set inspected after every job) is cleaned at the check-in, not inspected apart. */
export const hasUseRule = (item: KitItem) => item.inspection.usesLeft !== null;

export function CheckInItems({
  items,
  states,
  onChange,
}: {
  items: KitItem[];
  states: CheckInItemState;
  onChange: (next: CheckInItemState) => void;
}) {
  const set = (id: number, patch: Partial<CheckInItemState[number]>) =>
    onChange({ ...states, [id]: { ...(states[id] ?? { condition: 'in_service', cleaned: false }), ...patch } });
  return (
    <fieldset className="space-y-2">
      <legend className="mb-1 font-semibold">Condition of each item</legend>
      <p className="text-sm text-ink-muted">
        In service unless you change it. Out of service keeps it in the depot until it is repaired.
      </p>
      <ul className="space-y-2">
        {items.map((item) => {
          const state = states[item.id] ?? { condition: 'in_service' as const, cleaned: false };
          const selectId = `check-in-condition-${item.id}`;
          return (
            <li key={item.id} className="rounded-lg border border-line p-3">
              <label htmlFor={selectId} className="block font-semibold">
                {item.assetTag} <span className="font-normal text-ink-muted">{item.kind.name}</span>
              </label>
              <select
                id={selectId}
                aria-label={`Condition of ${item.assetTag}`}
                className="mt-1 min-h-12 w-full rounded-md border border-line-strong bg-card px-3 text-base"
                value={state.condition}
                onChange={(event) => set(item.id, { condition: event.target.value as ItemCondition })}
              >
                {itemConditions.map((c) => (
                  <option key={c} value={c}>
                    {itemConditionLabels[c]}
                  </option>
                ))}
              </select>
              {hasUseRule(item) ? (
                <label className="mt-2 flex min-h-12 cursor-pointer items-center gap-3">
                  <input
                    type="checkbox"
                    className="size-6 accent-brand-700"
                    checked={state.cleaned}
                    onChange={(event) => set(item.id, { cleaned: event.target.checked })}
                  />
                  <span>
                    Cleaned after the job
                    <span className="block text-sm text-ink-muted">
                      Recorded as its after-use inspection, so it is in date for the next job
                    </span>
                  </span>
                </label>
              ) : null}
            </li>
          );
        })}
      </ul>
    </fieldset>
  );
}

/** Which depot the kit comes back to (the first unless changed), a 48 px target on a phone. */
export function DepotSelect({ depots, error }: { depots: { id: number; name: string }[]; error?: string | undefined }) {
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor="check-in-depot" className="font-semibold">
        Back to depot
      </label>
      <select
        id="check-in-depot"
        name="toLocationId"
        defaultValue={String(depots[0]?.id ?? '')}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? 'check-in-depot-error' : undefined}
        className={`min-h-12 w-full rounded-md border bg-card px-3 text-base ${error ? 'border-danger-700' : 'border-line-strong'}`}
      >
        {depots.map((d) => (
          <option key={d.id} value={String(d.id)}>
            {d.name}
          </option>
        ))}
      </select>
      {error ? (
        <p id="check-in-depot-error" className="text-sm font-semibold text-danger-700">
          {error}
        </p>
      ) : null}
    </div>
  );
}
