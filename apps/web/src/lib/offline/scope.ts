import { createStore, delMany, keys, type UseStore } from 'idb-keyval';

/**
 * Whose data is on the phone: everything kept (the query cache, drafts, the write queue) is keyed by person and
 * firm, so one person's or firm's records never show to another on a shared phone, and sign-out wipes the person's.
 */
export interface OfflineScope {
  userId: number;
  firmId: number;
}

// The last signed-in person and firm, kept so the saved query cache can be opened before /api/me answers
// (with no signal it never does).
const POINTER_KEY = 'heatfleet.offline-scope';

function readPointer(): OfflineScope | null {
  try {
    const raw = localStorage.getItem(POINTER_KEY);
    const value = raw ? (JSON.parse(raw) as Partial<OfflineScope>) : null;
    return value && typeof value.userId === 'number' && typeof value.firmId === 'number'
      ? { userId: value.userId, firmId: value.firmId }
      : null;
  } catch {
    return null;
  }
}

let current: OfflineScope | null = typeof localStorage === 'undefined' ? null : readPointer();
const listeners = new Set<() => void>();

export function activeScope(): OfflineScope | null {
  return current;
}

export function sameScope(a: OfflineScope | null, b: OfflineScope | null): boolean {
  return a?.userId === b?.userId && a?.firmId === b?.firmId;
}

export function setActiveScope(scope: OfflineScope | null): void {
  if (sameScope(scope, current)) return;
  current = scope;
  try {
    if (scope) localStorage.setItem(POINTER_KEY, JSON.stringify(scope));
    else localStorage.removeItem(POINTER_KEY);
  } catch {
    // Private browsing may refuse storage; the app still works online.
  }
  for (const listener of listeners) listener();
}

export function subscribeScope(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

/** The key prefix of everything of one person ("u12:") or one person in one firm ("u12:f3:"). */
export function personPrefix(userId: number): string {
  return `u${userId}:`;
}

export function scopePrefix(scope: OfflineScope): string {
  return `${personPrefix(scope.userId)}f${scope.firmId}:`;
}

/** Sent with API reads so the service worker keeps each person's and firm's answers apart. */
export function scopeHeaderValue(scope: OfflineScope): string {
  return `u${scope.userId}-f${scope.firmId}`;
}

// One IndexedDB database per kind of record (idb-keyval opens one object store per database), opened on first use.
const opened = new Map<string, UseStore>();
function store(name: 'drafts' | 'outbox' | 'query-cache'): UseStore {
  let found = opened.get(name);
  if (!found) {
    found = createStore(`heatfleet-${name}`, name);
    opened.set(name, found);
  }
  return found;
}

export const draftStore = () => store('drafts');
export const outboxStore = () => store('outbox');
export const queryCacheStore = () => store('query-cache');

/** Deletes every record of one person on this phone (sign-out). */
export async function wipePerson(userId: number): Promise<void> {
  const prefix = personPrefix(userId);
  for (const kind of [draftStore, outboxStore, queryCacheStore]) {
    const own = (await keys<IDBValidKey>(kind())).filter((key) => String(key).startsWith(prefix));
    if (own.length) await delMany(own, kind());
  }
}
