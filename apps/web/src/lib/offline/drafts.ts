import { del, get, set } from 'idb-keyval';
import { activeScope, draftStore, scopePrefix, type OfflineScope } from '@/lib/offline/scope';

/**
 * What a form holds before the server has it, kept from the first keystroke. When the form is sent the draft
 * moves into the queued write (takeDraft), so the form starts afresh; if the server then refuses the write, the
 * draft comes back (restoreDraft) for the engineer to put right. Either way it is on the phone until confirmed.
 */
export interface DraftRecord<T = unknown> {
  value: T;
  savedAt: number;
}

const fullKey = (scope: OfflineScope, key: string) => `${scopePrefix(scope)}draft:${key}`;

export async function saveDraft<T>(key: string, value: T, scope = activeScope()): Promise<void> {
  if (!scope) return;
  const record: DraftRecord<T> = { value, savedAt: Date.now() };
  await set(fullKey(scope, key), record, draftStore()).catch(() => undefined);
}

export async function loadDraft<T>(key: string, scope = activeScope()): Promise<DraftRecord<T> | undefined> {
  if (!scope) return undefined;
  return get<DraftRecord<T>>(fullKey(scope, key), draftStore()).catch(() => undefined);
}

export async function clearDraft(key: string, scope = activeScope()): Promise<void> {
  if (!scope) return;
  await del(fullKey(scope, key), draftStore()).catch(() => undefined);
}

/** Puts a refused write's draft back for its form, unless the engineer has started another one since. */
export async function restoreDraft(key: string, record: DraftRecord, scope: OfflineScope): Promise<void> {
  if (await loadDraft(key, scope)) return;
  await set(fullKey(scope, key), record, draftStore()).catch(() => undefined);
}

/** Drops the form's draft if it is still the one a write carries (sent again as it is, or discarded). */
export async function dropDraftIfSame(key: string, record: DraftRecord, scope: OfflineScope): Promise<void> {
  const live = await loadDraft(key, scope);
  if (live && JSON.stringify(live.value) === JSON.stringify(record.value)) await clearDraft(key, scope);
}
