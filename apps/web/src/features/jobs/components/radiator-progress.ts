import type { SheetRadiator } from '@heatfleet/domain';

/**
 * Where each radiator stands in the work: read before (system hot, before the cleaner), agitated and
 * flushed until clear (in the flush order, the furthest from the rig first), read after. A radiator's
 * stage is the first part not done; agitation may be skipped, so a flushed radiator has passed it.
 */
export type RadiatorStage = 'before' | 'agitate' | 'flush' | 'after' | 'done';
export const stageRank: Record<RadiatorStage, number> = { before: 0, agitate: 1, flush: 2, after: 3, done: 4 };

export const stageWords: Record<RadiatorStage, string> = {
  before: 'reading before',
  agitate: 'agitation and flush',
  flush: 'flush until clear',
  after: 'reading after',
  done: 'done',
};

export function radiatorStage(r: SheetRadiator): RadiatorStage {
  if (!r.before) return 'before';
  if (!r.flushedAt) return r.agitation ? 'flush' : 'agitate';
  return r.after ? 'done' : 'after';
}

/** The radiators in the flush order; any the order leaves out follow in survey order. */
export function inFlushOrder(radiators: readonly SheetRadiator[], order: readonly number[]): SheetRadiator[] {
  const byIndex = new Map(radiators.map((r) => [r.index, r]));
  const listed = order.map((i) => byIndex.get(i)).filter((r): r is SheetRadiator => r !== undefined);
  const seen = new Set(listed.map((r) => r.index));
  return [...listed, ...radiators.filter((r) => !seen.has(r.index))];
}

/** The one to do next: the earliest stage of the work first, then the flush order. */
export function nextRadiator(ordered: readonly SheetRadiator[]): SheetRadiator | null {
  let best: SheetRadiator | null = null;
  for (const r of ordered) {
    const stage = radiatorStage(r);
    if (stage === 'done') continue;
    if (!best || stageRank[stage] < stageRank[radiatorStage(best)]) best = r;
  }
  return best;
}

/**
 * "Next radiator" from the one open: the next in the flush order still at the stage the engineer was
 * working on (a sweep of before readings, then of agitation and flush, then of after readings); when
 * that sweep is finished, the next thing anywhere. Null when every radiator is done.
 */
export function radiatorAfter(
  ordered: readonly SheetRadiator[],
  currentIndex: number,
  workingStage: RadiatorStage,
): SheetRadiator | null {
  const at = ordered.findIndex((r) => r.index === currentIndex);
  const rest = [...ordered.slice(at + 1), ...ordered.slice(0, Math.max(at, 0))];
  const sameSweep =
    workingStage === 'done'
      ? undefined
      : rest.find((r) => {
          const stage = radiatorStage(r);
          // Agitating and flushing are one sweep.
          const sweep = (s: RadiatorStage) => (s === 'flush' ? 'agitate' : s);
          return sweep(stage) === sweep(workingStage);
        });
  if (sameSweep) return sameSweep;
  return nextRadiator(rest);
}

export interface RadiatorCounts {
  total: number;
  before: number;
  agitated: number;
  flushed: number;
  after: number;
  coldBottom: number;
}

export function radiatorCounts(radiators: readonly SheetRadiator[]): RadiatorCounts {
  return {
    total: radiators.length,
    before: radiators.filter((r) => r.before).length,
    agitated: radiators.filter((r) => r.agitation).length,
    flushed: radiators.filter((r) => r.flushedAt).length,
    after: radiators.filter((r) => r.after).length,
    coldBottom: radiators.filter((r) => (r.after ?? r.before)?.coldBottom).length,
  };
}

/**
 * The vibrating tool a radiator's agitation starts with: the one used on the radiator before it in the
 * flush order, else the last one used on this job, else the van's only tool with a vibration figure.
 */
export function defaultToolId(
  ordered: readonly SheetRadiator[],
  index: number,
  toolsOnVan: readonly { id: number; vibrationMs2: number | null }[],
): number | null {
  const at = ordered.findIndex((r) => r.index === index);
  for (let i = at - 1; i >= 0; i--) {
    const used = ordered[i]!.agitation?.kitItemId;
    if (used) return used;
  }
  const anyUsed = [...ordered].reverse().find((r) => r.agitation?.kitItemId)?.agitation?.kitItemId;
  if (anyUsed) return anyUsed;
  const vibrating = toolsOnVan.filter((t) => t.vibrationMs2 !== null);
  return vibrating.length === 1 ? vibrating[0]!.id : null;
}
