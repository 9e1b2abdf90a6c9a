/**
 * Hot circulation of the cleaner: the clock starts when the cleaner is dosed and stops when the
 * circulate step is ticked (or runs on to now while it is not). The minimum is the cleaner's own,
 * from its label; with several cleaners on one job the longest minimum governs.
 */
export interface Circulation {
  minimumMinutes: number | null;
  startedAt: string | null;
  elapsedMinutes: number | null;
  /** Null when no cleaner sets a minimum; false until the elapsed time reaches it. */
  met: boolean | null;
}

export function circulationMinimumMinutes(
  products: readonly { kind: string; minCirculationMinutes: number | null }[],
): number | null {
  const minimums = products
    .filter((p) => p.kind === 'cleaner' && p.minCirculationMinutes !== null)
    .map((p) => p.minCirculationMinutes!);
  return minimums.length ? Math.max(...minimums) : null;
}

/** Whole minutes circulated, and whether the minimum is met; `now` stands in for a stop not yet ticked. */
export function circulationClock(
  minimumMinutes: number | null,
  startedAt: Date | null,
  endedAt: Date | null,
  now: Date,
): Circulation {
  const ended = endedAt ?? now;
  const elapsedMinutes = startedAt ? Math.max(0, Math.floor((ended.getTime() - startedAt.getTime()) / 60_000)) : null;
  return {
    minimumMinutes,
    startedAt: startedAt?.toISOString() ?? null,
    elapsedMinutes,
    met: minimumMinutes === null ? null : elapsedMinutes !== null && elapsedMinutes >= minimumMinutes,
  };
}
