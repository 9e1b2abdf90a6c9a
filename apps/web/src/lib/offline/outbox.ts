import { useSyncExternalStore } from 'react';
import { del, entries, set } from 'idb-keyval';
import type { DraftRecord } from '@/lib/offline/drafts';
import { outboxStore, personPrefix } from '@/lib/offline/scope';

/** A photo sent before its write (a check-in's photo): its id goes into the write's body. */
export interface QueuedUpload {
  path: string;
  field: string;
  fileName: string;
  file: Blob;
  fields?: Record<string, string>;
  /** Where the id is in the upload's answer, e.g. "photo.id". */
  idFrom: string;
  /** The body field the id goes in, e.g. "photoId". */
  bodyKey: string;
  /** Kept once uploaded, so a reload or a retry never uploads it twice. */
  uploadedId?: number;
}

/** A write that is itself a multipart upload (a job's photo): the file and its fields, sent to the write's path. */
export interface QueuedForm {
  field: string;
  fileName: string;
  file: Blob;
  fields: Record<string, string>;
}

/**
 * One write waiting on the phone: what to send, made when the engineer tapped (its Idempotency-Key and the tap
 * time), for which person and firm. Kept in IndexedDB until the server confirms it.
 */
export interface QueuedWrite {
  id: string;
  /** Sends go in this order (the time of the tap, then a counter). */
  seq: string;
  userId: number;
  firmId: number;
  firmName: string;
  method: 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  path: string;
  body: unknown;
  idempotencyKey: string;
  /** ISO 8601, in the server's clock as the phone last knew it; sent as X-Tapped-At. */
  tappedAt: string;
  /** In the engineer's words: "Check out Rig 4 to Van 1". */
  label: string;
  /** The page where it was made, to go back to it from the attention list. */
  href?: string;
  /** Lets a feature find its own waiting writes (custody shows where the kit will be). */
  group?: string;
  meta?: unknown;
  /** The form's draft key, and the draft itself, moved here when the write was queued; back to the form if refused. */
  draftKey?: string;
  draft?: DraftRecord;
  /** Query keys to refresh once it is sent. */
  invalidate?: readonly (readonly unknown[])[];
  upload?: QueuedUpload;
  /** Sent as multipart (the body is ignored): a job's photo, with the write's own Idempotency-Key and tap time. */
  form?: QueuedForm;
  /** waiting: to be sent; attention: the server refused it after a replay, with its message. */
  state: 'waiting' | 'attention';
  attempts: number;
  problem?: { status: number; message: string; at: string };
}

const keyOf = (write: Pick<QueuedWrite, 'userId' | 'seq'>) => `${personPrefix(write.userId)}${write.seq}`;

let snapshot: { userId: number | null; writes: QueuedWrite[] } = { userId: null, writes: [] };
const listeners = new Set<() => void>();
// Other tabs of the app send and change the same queue: each change is announced so every tab shows the same.
const channel = typeof BroadcastChannel === 'undefined' ? null : new BroadcastChannel('heatfleet-outbox');

function publish(writes: QueuedWrite[]): void {
  snapshot = { userId: snapshot.userId, writes };
  for (const listener of listeners) listener();
}

/** Reads the person's queue from IndexedDB (at start, after sign-in, when another tab changed it). */
export async function reloadOutbox(userId: number | null): Promise<void> {
  snapshot = { userId, writes: userId === snapshot.userId ? snapshot.writes : [] };
  if (userId === null) return publish([]);
  const prefix = personPrefix(userId);
  const all = await entries<IDBValidKey, QueuedWrite>(outboxStore()).catch(() => []);
  if (snapshot.userId !== userId) return;
  const own = all.filter(([key]) => String(key).startsWith(prefix)).map(([, write]) => write);
  publish(own.sort((a, b) => (a.seq < b.seq ? -1 : a.seq > b.seq ? 1 : 0)));
}

channel?.addEventListener('message', () => void reloadOutbox(snapshot.userId));

export function outboxWrites(): QueuedWrite[] {
  return snapshot.writes;
}

export function findWrite(id: string): QueuedWrite | undefined {
  return snapshot.writes.find((write) => write.id === id);
}

/** Adds or replaces a write; resolves once IndexedDB holds it. */
export async function saveWrite(write: QueuedWrite): Promise<void> {
  await set(keyOf(write), write, outboxStore());
  if (write.userId === snapshot.userId) {
    const others = snapshot.writes.filter((w) => w.id !== write.id);
    publish([...others, write].sort((a, b) => (a.seq < b.seq ? -1 : a.seq > b.seq ? 1 : 0)));
  }
  channel?.postMessage('changed');
}

export async function deleteWrite(write: QueuedWrite): Promise<void> {
  await del(keyOf(write), outboxStore());
  publish(snapshot.writes.filter((w) => w.id !== write.id));
  channel?.postMessage('changed');
}

let counter = 0;
/** Orders writes by the tap, then by a counter for taps in the same millisecond. */
export function nextSeq(): string {
  counter = (counter + 1) % 1000;
  return `${Date.now().toString().padStart(15, '0')}-${counter.toString().padStart(3, '0')}`;
}

function subscribe(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

/** The signed-in person's queue, in order, for every firm they belong to. */
export function useOutbox(): QueuedWrite[] {
  return useSyncExternalStore(subscribe, outboxWrites, outboxWrites);
}
