import type { CheckInInput, KitItem } from '@heatfleet/domain';
import { ruleBroken } from '../../lib/http-error.ts';

/**
 * Each item's condition at a check-in (its own when listed, else the check-in's, in service unless
 * said otherwise) and the items ticked as cleaned. A listed item must be one being checked in; the
 * tick is for kinds inspected by uses (a magnet set cleaned after each job), not for a dated inspection.
 */
export function checkInPerItem(items: KitItem[], input: CheckInInput) {
  const byId = new Map(items.map((i) => [i.id, i]));
  const stray = (input.items ?? []).filter((e) => !byId.has(e.itemId));
  if (stray.length)
    throw ruleBroken(
      `Item ${stray.map((e) => e.itemId).join(', ')} is not among the items being checked in.`,
      stray.map((e) => ({ path: `items.${e.itemId}`, message: 'Not being checked in' })),
    );
  const listed = new Map((input.items ?? []).map((e) => [e.itemId, e]));
  const condition = new Map(items.map((i) => [i.id, listed.get(i.id)?.condition ?? input.condition]));
  const cleaned = items.filter((i) => listed.get(i.id)?.cleaned);
  const noUseRule = cleaned.filter((i) => i.inspection.usesLeft === null);
  if (noUseRule.length)
    throw ruleBroken(
      `${noUseRule.map((i) => `${i.assetTag} (${i.kind.name})`).join(', ')} has no after-use rule, so it is not ticked as cleaned; record an inspection instead.`,
      noUseRule.map((i) => ({ path: `items.${i.id}.cleaned`, message: 'No after-use rule' })),
    );
  return { condition, cleaned: cleaned.map((i) => i.id) };
}
