import { useSyncExternalStore } from 'react';
import type { QueryClient } from '@tanstack/react-query';
import { meEnvelopeSchema, type Me } from '@heatfleet/domain';
import { apiClient, ApiError, isApiError, refreshCsrfToken } from '@/lib/api-client';
import { restoreDraft } from '@/lib/offline/drafts';
import { withOutboxLock } from '@/lib/offline/outbox-lock';
import { deleteWrite, outboxWrites, saveWrite, type QueuedWrite } from '@/lib/offline/outbox';

/** Why waiting writes are not going out just now. */
export type Hold = 'offline' | 'network' | 'signed-out' | 'other-person' | null;
export type FirstAttempt =
  | { kind: 'sent'; body: unknown }
  | { kind: 'refused'; error: ApiError }
  | { kind: 'held'; why: Exclude<Hold, null> | 'other-firm' };
export type Settled = 'sent' | 'attention' | 'discarded';

let state: { sending: boolean; hold: Hold } = { sending: false, hold: null };
const listeners = new Set<() => void>();
function setState(next: Partial<typeof state>): void {
  state = { ...state, ...next };
  for (const listener of listeners) listener();
}

export function useSenderState(): typeof state {
  return useSyncExternalStore(
    (listener) => {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
    () => state,
  );
}

// The engineer is watching the first attempt of a write just made: a refusal then goes back to the form (which
// shows it in place) rather than to the attention list. Later outcomes are told to whoever is still listening.
const firstAttempts = new Map<string, (outcome: FirstAttempt) => void>();
const settlements = new Map<string, (outcome: Settled) => void>();

export function awaitFirstAttempt(id: string): Promise<FirstAttempt> {
  return new Promise((resolve) => firstAttempts.set(id, resolve));
}
export function awaitSettled(id: string): Promise<Settled> {
  return new Promise((resolve) => settlements.set(id, resolve));
}
function tellFirst(id: string, outcome: FirstAttempt): boolean {
  const resolve = firstAttempts.get(id);
  firstAttempts.delete(id);
  resolve?.(outcome);
  return resolve !== undefined;
}
export function tellSettled(id: string, outcome: Settled): void {
  settlements.get(id)?.(outcome);
  settlements.delete(id);
}

let queryClient: QueryClient | null = null;
export function setOutboxQueryClient(client: QueryClient): void {
  queryClient = client;
}

// Retries after a failed send: 3 s, doubling to at most a minute, while the phone says it is online.
let retryTimer: ReturnType<typeof setTimeout> | null = null;
let retryDelayMs = 3_000;
function scheduleRetry(): void {
  if (retryTimer) return;
  retryTimer = setTimeout(() => {
    retryTimer = null;
    void sendOutbox();
  }, retryDelayMs);
  retryDelayMs = Math.min(retryDelayMs * 2, 60_000);
}

/** Whether a failure is the network's or the server's for now (try again later) rather than a refusal. */
function isTransient(error: ApiError): boolean {
  return error.status === 0 || error.status === 408 || error.status === 429 || error.status >= 500;
}

function valueAt(body: unknown, path: string): unknown {
  return path.split('.').reduce<unknown>((at, part) => (at as Record<string, unknown> | null)?.[part], body);
}

async function sendOne(write: QueuedWrite): Promise<unknown> {
  let body = write.body;
  if (write.upload) {
    const upload = write.upload;
    if (upload.uploadedId === undefined) {
      const form = new FormData();
      form.append(upload.field, upload.file, upload.fileName);
      for (const [name, value] of Object.entries(upload.fields ?? {})) form.append(name, value);
      // A key of its own, made from the write's: an upload whose answer was lost is not stored twice.
      const id = valueAt(
        await apiClient.write('POST', upload.path, form, {
          idempotencyKey: `${write.idempotencyKey}:photo`,
          tappedAt: write.tappedAt,
        }),
        upload.idFrom,
      );
      if (typeof id !== 'number')
        throw new ApiError({ status: 500, code: 'UploadUnread', message: 'The photo upload answered without its id.' });
      upload.uploadedId = id;
      await saveWrite(write);
    }
    body = { ...(body as Record<string, unknown>), [upload.bodyKey]: upload.uploadedId };
  }
  if (write.form) {
    const form = new FormData();
    // The fields first, the file last: the server may stream the file before it reads fields after it.
    for (const [name, value] of Object.entries(write.form.fields)) form.append(name, value);
    form.append(write.form.field, write.form.file, write.form.fileName);
    body = form;
  }
  return apiClient.write(write.method, write.path, body, {
    idempotencyKey: write.idempotencyKey,
    tappedAt: write.tappedAt,
  });
}

async function confirmed(write: QueuedWrite, body: unknown): Promise<void> {
  await deleteWrite(write);
  for (const key of write.invalidate ?? []) void queryClient?.invalidateQueries({ queryKey: key });
  if (!tellFirst(write.id, { kind: 'sent', body })) tellSettled(write.id, 'sent');
}

async function refused(write: QueuedWrite, error: ApiError): Promise<void> {
  const scope = { userId: write.userId, firmId: write.firmId };
  // What was typed goes back to the form: shown in place now, or there when the engineer opens it.
  if (write.draftKey && write.draft) await restoreDraft(write.draftKey, write.draft, scope);
  if (firstAttempts.has(write.id)) {
    await deleteWrite(write);
    tellFirst(write.id, { kind: 'refused', error });
    return;
  }
  const problem = { status: error.status, message: error.message, at: new Date().toISOString() };
  await saveWrite({ ...write, state: 'attention', problem });
  tellSettled(write.id, 'attention');
}

/** Who is signed in now, asked of the server itself (never the service worker's copy). */
async function freshMe(): Promise<Me | null> {
  try {
    return (await apiClient.get('/api/me', meEnvelopeSchema, { fresh: true })).me;
  } catch (error) {
    if (isApiError(error, 401)) return null;
    throw error;
  }
}

async function sendWaiting(): Promise<void> {
  const waiting = outboxWrites().filter((write) => write.state === 'waiting');
  if (waiting.length === 0) return setState({ hold: null });
  let me: Me | null;
  try {
    me = await freshMe();
  } catch {
    setState({ hold: 'network' });
    return scheduleRetry();
  }
  if (!me) {
    // The session ended: keep everything, and ask the engineer to sign in again (the session query refetches).
    setState({ hold: 'signed-out' });
    void queryClient?.invalidateQueries({ predicate: (query) => query.meta?.session === true });
    return;
  }
  if (me.user.id !== waiting[0]!.userId) return setState({ hold: 'other-person' });
  await refreshCsrfToken();
  for (const write of waiting) {
    // A write for another firm waits until the engineer is working in that firm again.
    if (write.firmId !== me.activeFirm.id) {
      tellFirst(write.id, { kind: 'held', why: 'other-firm' });
      continue;
    }
    try {
      await confirmed(write, await sendOne(write));
    } catch (error) {
      const failure = isApiError(error)
        ? error
        : new ApiError({ status: 0, code: 'NetworkError', message: String(error) });
      if (failure.status === 401) {
        setState({ hold: 'signed-out' });
        void queryClient?.invalidateQueries({ predicate: (query) => query.meta?.session === true });
        return;
      }
      if (isTransient(failure)) {
        await saveWrite({ ...write, attempts: write.attempts + 1 });
        setState({ hold: navigator.onLine ? 'network' : 'offline' });
        if (navigator.onLine) scheduleRetry();
        return;
      }
      await refused(write, failure);
    }
  }
  retryDelayMs = 3_000;
  setState({ hold: null });
}

let running: Promise<void> | null = null;
let again = false;

/**
 * Sends the waiting writes in order: when a write is made, when the signal returns, when the app opens and after
 * a failure. One pass at a time; a call during a pass runs another pass after it.
 */
export function sendOutbox(): Promise<void> {
  if (typeof navigator !== 'undefined' && !navigator.onLine) {
    setState({ hold: 'offline' });
    for (const id of [...firstAttempts.keys()]) tellFirst(id, { kind: 'held', why: 'offline' });
    return Promise.resolve();
  }
  if (running) {
    again = true;
    return running;
  }
  setState({ sending: true });
  running = withOutboxLock(sendWaiting)
    .catch(() => setState({ hold: 'network' }))
    .finally(() => {
      running = null;
      setState({ sending: false });
      if (again) {
        again = false;
        void sendOutbox();
        return;
      }
      // Anyone still waiting for a first attempt was behind a write that could not go.
      for (const id of [...firstAttempts.keys()]) tellFirst(id, { kind: 'held', why: state.hold ?? 'network' });
    });
  return running;
}
