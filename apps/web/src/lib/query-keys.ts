/**
 * The roots of the query keys that one feature invalidates for another. Features do not import each
 * other, so a change that makes another feature's answers stale (a completed job takes stock off a
 * van) invalidates that feature's root from here, and the feature's own factory builds its keys on
 * the same root, so the two cannot drift apart.
 */
export const queryRoots = {
  stock: ['stock'],
  vans: ['vans'],
  jobs: ['jobs'],
} as const;
