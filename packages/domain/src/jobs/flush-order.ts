/**
 * The flush goes from the radiator furthest from the rig back towards it (common practice (no
 * source)). The engineer sets the order once per site; it is kept as the radiators' rooms, so the
 * next visit's survey, entered afresh, finds its radiators in it by room.
 */

/** Whether `indexes` names every radiator of a survey of `count` radiators exactly once. */
export function isWholeFlushOrder(indexes: readonly number[], count: number): boolean {
  return indexes.length === count && new Set(indexes).size === count && indexes.every((i) => i >= 0 && i < count);
}

/** The rooms in flush order, as the site keeps them. */
export function flushOrderRooms(indexes: readonly number[], rooms: readonly string[]): string[] {
  return indexes.map((i) => rooms[i] ?? '');
}

/**
 * A survey's radiators in the site's kept order: each kept room takes the first radiator of that
 * room (ignoring case) not yet placed; radiators the kept order does not know follow in survey order.
 */
export function flushOrderFor(
  keptRooms: readonly string[] | null,
  rooms: readonly string[],
): { radiatorIndexes: number[]; from: 'site' | 'survey' } {
  const surveyOrder = rooms.map((_, i) => i);
  if (!keptRooms || keptRooms.length === 0) return { radiatorIndexes: surveyOrder, from: 'survey' };
  const placed = new Set<number>();
  const order: number[] = [];
  for (const room of keptRooms) {
    const key = room.trim().toLowerCase();
    const i = rooms.findIndex((r, j) => !placed.has(j) && r.trim().toLowerCase() === key);
    if (i >= 0) {
      placed.add(i);
      order.push(i);
    }
  }
  for (const i of surveyOrder) if (!placed.has(i)) order.push(i);
  return { radiatorIndexes: order, from: 'site' };
}
